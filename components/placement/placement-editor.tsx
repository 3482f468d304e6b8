/**
 * Edits one mirror mount and shows its live numbers, put together from four parts: the form
 * (placement-form.tsx), the conflict panel and save status (placement-save-state.tsx), the
 * evaluation (placement-live-numbers.tsx) and the delete confirmation (placement-delete.tsx).
 * It keeps no copy of the mirror: every change goes into the plan's write path at once (so the plan
 * redraws) and is saved a moment after typing stops; the numbers come from the plan's evaluation.
 */
import { useState } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/constants/theme';
import { useIsOnline } from '@/hooks/use-connection';
import { AUTOSAVE_MS, type PlacementEdits, type PlacementWrites } from '@/hooks/use-placement-writes';
import type { ProjectEvaluation } from '@/shared/project-optics';
import type { CatalogueItemDto, PlacementDto, ProjectDto, Scene } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';
import { PhotoGallery } from '@/components/uploads/photo-gallery';
import { PlacementDelete } from './placement-delete';
import { PlacementForm } from './placement-form';
import { PlacementLiveNumbers } from './placement-live-numbers';
import { EditorConflictPanel, SaveStatus } from './placement-save-state';

export interface PlacementEditorProps {
  project: ProjectDto;
  /** The plan's live scene: its viewers (unsaved ones too) and the zones the numbers name. */
  scene: Scene;
  /** The plan's live placement: saved values, unsaved edits and a drag in progress, or null when gone. */
  placement: PlacementDto | null;
  /** The plan's placement write path (unsaved edits, ordered saves, conflicts). */
  writes: PlacementWrites;
  /** The plan's evaluation (its cached evaluator), which already includes this mirror's unsaved values. */
  evaluation: ProjectEvaluation | null;
  catalogue: readonly CatalogueItemDto[];
  units: UnitSystem;
  canEdit: boolean;
  onClose?: () => void;
}

/** Wide enough inside its own box (not the window: it may sit in a side panel) for two columns. */
const TWO_COLUMNS_FROM = 760;

/** Keyed by project and placement, so switching mirrors starts with fresh UI state (picker, confirmation). */
export function PlacementEditor(props: PlacementEditorProps) {
  return <PlacementEditorInner key={`${props.project.id}:${props.placement?.id ?? 'gone'}`} {...props} />;
}

function PlacementEditorInner({ project, scene, placement, writes, evaluation, catalogue, units, canEdit, onClose }: PlacementEditorProps) {
  const [width, setWidth] = useState(0);
  const online = useIsOnline();
  const onLayout = (e: LayoutChangeEvent) => setWidth(e.nativeEvent.layout.width);

  if (!placement) {
    return (
      <View style={styles.root} testID="placement-editor">
        <Notice tone="info" testID="placement-gone">
          This mirror is no longer in the project; it may have been removed.
        </Notice>
        {onClose ? <Button label="Close" testID="placement-close" variant="secondary" onPress={onClose} /> : null}
      </View>
    );
  }

  const id = placement.id;
  const dirty = Boolean(writes.unsaved[id]);
  const conflict = writes.conflicts[id] ?? null;
  const problem = writes.problems[id] ?? null;
  const saveNow = () => writes.save(id);
  const twoColumns = width >= TWO_COLUMNS_FROM;
  const column = [styles.column, twoColumns && styles.columnInRow];

  const close = () => {
    if (dirty) saveNow();
    onClose?.();
  };

  return (
    <View style={styles.root} testID="placement-editor" onLayout={onLayout}>
      <View style={styles.head}>
        <View style={styles.flex}>
          <AppText variant="heading" role="heading" aria-level={2}>
            {placement.label}
          </AppText>
          <SaveStatus
            canEdit={canEdit}
            dirty={dirty}
            saving={writes.saving}
            offline={!online}
            error={problem?.message || null}
            conflict={Boolean(conflict)}
          />
        </View>
        {onClose ? <Button label="Close" testID="placement-close" variant="secondary" onPress={close} /> : null}
      </View>

      <EditorConflictPanel
        conflict={conflict}
        problem={problem}
        units={units}
        catalogue={catalogue}
        onKeepMine={() => writes.keepMine(id)}
        onUseTheirs={() => writes.useTheirs(id)}
      />

      <View style={twoColumns ? styles.columns : styles.stack}>
        <View style={column}>
          <PlacementForm
            placement={placement}
            viewers={scene.viewers}
            catalogue={catalogue}
            units={units}
            canEdit={canEdit}
            errors={problem?.fields ?? {}}
            onChange={(patch: PlacementEdits) => writes.change(id, patch, AUTOSAVE_MS)}
            onCommit={saveNow}
          />
        </View>
        <View style={column}>
          <PlacementLiveNumbers placementId={id} placement={placement} evaluation={evaluation} scene={scene} units={units} />
        </View>
      </View>

      <View style={styles.photos}>
        <AppText variant="caps" tone="muted" role="heading" aria-level={3}>
          Photos of this mirror as mounted
        </AppText>
        <PhotoGallery projectId={project.id} placementId={id} canEdit={canEdit} testID="placement-photos" />
      </View>

      {canEdit ? (
        <View style={styles.actions}>
          <Button
            label={writes.saving ? (online ? 'Saving…' : 'Waiting for a connection') : 'Save now'}
            testID="placement-save"
            onPress={saveNow}
            disabled={!dirty || Boolean(conflict)}
            busy={writes.saving && online}
          />
          <PlacementDelete
            label={placement.label}
            removing={writes.removing}
            onRemove={() => writes.remove(id)}
            onRemoved={() => onClose?.()}
          />
        </View>
      ) : (
        <AppText tone="muted" testID="placement-read-only">
          You can read this mirror’s values; only the project’s installer can change them.
        </AppText>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.lg, alignSelf: 'stretch' },
  head: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.md },
  columns: { flexDirection: 'row', gap: spacing.xl, alignItems: 'flex-start' },
  stack: { gap: spacing.xl },
  column: { gap: spacing.lg, minWidth: 0 },
  // Only side by side may a column grow and shrink: stacked, a zero flex basis let the actions below
  // be drawn over the cautions.
  columnInRow: { flex: 1 },
  flex: { flex: 1 },
  photos: { gap: spacing.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, alignItems: 'center' },
});
