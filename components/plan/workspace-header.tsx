/** The project screen's top row: back to the list, the project's name, read-only mark and save status. */
import { StyleSheet, View } from 'react-native';
import { AppText, Badge, TextLink } from '@/components/ui';
import { layout, palette, spacing } from '@/constants/theme';
import { useIsOnline } from '@/hooks/use-connection';
import type { ProjectDto } from '@/shared/schemas';
import { StateBadge } from '@/components/review/state-badge';

export interface WorkspaceHeaderProps {
  project: ProjectDto;
  wide: boolean;
  saving: boolean;
  /** The last plan save failed. */
  failed: boolean;
  /** Something (scene or a mirror) is not saved yet. */
  unsaved: boolean;
}

export function WorkspaceHeader({ project, wide, saving, failed, unsaved }: WorkspaceHeaderProps) {
  const online = useIsOnline();
  return (
    <View style={[styles.header, wide && styles.headerWide]}>
      <TextLink href="/projects" label="‹ Projects" testID="project-back" />
      <View style={styles.main}>
        <AppText variant={wide ? 'heading' : 'label'} numberOfLines={1} role="heading" aria-level={1} testID="project-title">
          {project.name}
        </AppText>
        {wide && (project.customer || project.site) ? (
          <AppText variant="small" tone="muted" numberOfLines={1}>
            {[project.customer, project.site].filter(Boolean).join(' · ')}
          </AppText>
        ) : null}
        {/* On a phone the state goes under the name, so a long state never squeezes the name away. */}
        {wide ? null : <StateBadge state={project.state} testID="project-state" />}
      </View>
      {wide ? <StateBadge state={project.state} testID="project-state" /> : null}
      {!project.canEdit ? <Badge label="Read only" tone="glass" testID="project-read-only" /> : null}
      <AppText variant="small" tone={failed ? 'stop' : 'muted'} testID="plan-save-status" aria-live="polite">
        {saving ? (online ? 'Saving…' : 'Waiting') : failed && unsaved ? 'Not saved' : ''}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  header: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    paddingHorizontal: spacing.sm,
    minHeight: layout.minTarget,
    backgroundColor: palette.chalk,
    borderBottomWidth: 1,
    borderBottomColor: palette.ruleSoft,
  },
  headerWide: { paddingHorizontal: spacing.lg, paddingVertical: spacing.sm },
  main: { flex: 1, minWidth: 0 },
});
