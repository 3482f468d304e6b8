import { router } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { openOnEnterOrSpace } from '@/components/ui/link-keys';
import { AppText } from '@/components/ui/text';
import { StateBadge } from '@/components/review/state-badge';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import type { ProjectSummaryDto } from '@/shared/schemas';
import { lastChangeText } from './relative-time';

export function mirrorsText(n: number): string {
  return n === 0 ? 'No mirrors yet' : n === 1 ? '1 mirror' : `${n} mirrors`;
}

/**
 * One project in the list; the whole row is the link (a big target for a thumb). The link's name
 * is its visible text (name, place, state, mirrors, last change), so what a screen reader says and
 * what a speech user reads on screen are the same; no separate label that could leave some out.
 */
export function ProjectRow({ project, showOwner }: { project: ProjectSummaryDto; showOwner: boolean }) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  const where = [project.customer, project.site].filter(Boolean).join(' · ');
  const open = () => router.push(`/projects/${project.id}`);
  return (
    <View role="listitem" onKeyDownCapture={openOnEnterOrSpace(open)}>
      <Pressable
        testID={`project-row-${project.id}`}
        role="link"
        onPress={open}
        onFocus={onFocus}
        onBlur={onBlur}
        style={({ hovered, pressed }) => [styles.row, (hovered || pressed) && styles.rowHover, focusVisible && focusRing]}
      >
        <View style={styles.main}>
          <View style={styles.titleLine}>
            <AppText variant="bodyStrong" style={styles.name} numberOfLines={2}>
              {project.name}
            </AppText>
            <StateBadge state={project.state} testID={`project-status-${project.id}`} />
          </View>
          <AppText tone="muted" numberOfLines={2}>
            {where || 'No customer or site given'}
          </AppText>
          <View style={styles.meta}>
            <AppText variant="small" testID={`project-mirrors-${project.id}`}>
              {mirrorsText(project.placementCount)}
            </AppText>
            <AppText variant="small" tone="muted" testID={`project-changed-${project.id}`}>
              {`Changed ${lastChangeText(project.updatedAt)}`}
            </AppText>
            {showOwner ? (
              <AppText variant="small" tone="muted">
                {`Installer: ${project.ownerName}`}
              </AppText>
            ) : null}
          </View>
        </View>
        <AppText variant="heading" tone="glass" aria-hidden>
          ›
        </AppText>
      </Pressable>
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    minHeight: layout.minTarget + 24,
    padding: spacing.lg,
    backgroundColor: palette.card,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: palette.ruleSoft,
  },
  rowHover: { borderColor: palette.glass, backgroundColor: palette.glassSoft },
  main: { flex: 1, gap: spacing.xs },
  titleLine: { flexDirection: 'row', gap: spacing.sm, alignItems: 'center', flexWrap: 'wrap' },
  name: { flexShrink: 1 },
  meta: { flexDirection: 'row', flexWrap: 'wrap', columnGap: spacing.lg, rowGap: spacing.xxs },
});
