import { useState } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { NumberField } from '@/components/ui/number-field';
import { SafetyCautions } from '@/components/ui/safety-cautions';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { palette, spacing } from '@/constants/theme';
import { AUTOSAVE_MS, type PlacementEdits, type PlacementWrites } from '@/hooks/use-placement-writes';
import { describeError } from '@/shared/errors';
import type { ProjectEvaluation } from '@/shared/project-optics';
import type { CatalogueItemDto, PlacementDto, ProjectDto } from '@/shared/schemas';
import { PLACEMENT_LIMITS } from '@/shared/schemas/limits';
import { formatAngle, formatLength, type UnitSystem } from '@/shared/units';
import { ChoiceChips } from './choice-chips';
import { ElevationView } from './elevation-view';
import { MirrorPicker, type MirrorChoice } from './mirror-picker';
import { mirrorSizeText, radiusText, SHAPE_LABELS } from './mirror-text';
import { PlacementNumbersPanel } from './numbers-panel';
import { PlacementConflictNotice } from './placement-conflict';

export interface PlacementEditorProps {
  project: ProjectDto;
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
const DEG = Math.PI / 180;

/**
 * Edits one mirror mount and shows its live numbers. It keeps no copy of the mirror: every change
 * goes into the plan's write path at once (so the plan redraws) and is saved a moment after typing
 * stops. Keyed by placement so switching mirrors starts fresh UI state.
 */
export function PlacementEditor(props: PlacementEditorProps) {
  return <PlacementEditorInner key={`${props.project.id}:${props.placement?.id ?? 'gone'}`} {...props} />;
}

function PlacementEditorInner({ project, placement: draft, writes, evaluation, catalogue, units, canEdit, onClose }: PlacementEditorProps) {
  const [confirmDelete, setConfirmDelete] = useState(false);
  const [removeError, setRemoveError] = useState<unknown>(null);
  const [showPicker, setShowPicker] = useState(false);
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(e.nativeEvent.layout.width);

  if (!draft) {
    return (
      <View style={styles.root} testID="placement-editor">
        <Notice tone="info" testID="placement-gone">
          This mirror is no longer in the project; it may have been removed.
        </Notice>
        {onClose ? <Button label="Close" testID="placement-close" variant="secondary" onPress={onClose} /> : null}
      </View>
    );
  }

  const id = draft.id;
  const dirty = Boolean(writes.unsaved[id]);
  const conflict = writes.conflicts[id] ?? null;
  const problem = writes.problems[id] ?? null;
  const live = evaluation ? { evaluation: evaluation.placements.find((p) => p.placementId === id) ?? null, zones: evaluation.zones } : null;
  const e = problem?.fields ?? {};
  const set = (patch: PlacementEdits) => writes.change(id, patch, AUTOSAVE_MS);
  const saveNow = () => writes.save(id);
  const item = draft.catalogueItemId !== null ? (catalogue.find((c) => c.id === draft.catalogueItemId) ?? null) : null;
  const spec = draft.customMirror ?? item?.mirror ?? null;
  const mirrorChoice: MirrorChoice = draft.customMirror
    ? { catalogueItemId: null, customMirror: draft.customMirror }
    : { catalogueItemId: draft.catalogueItemId ?? -1, customMirror: null };
  const heightStep = units === 'metric' ? 0.05 : 2 * 0.0254;
  const twoColumns = width >= TWO_COLUMNS_FROM;

  const close = () => {
    if (dirty) saveNow();
    onClose?.();
  };

  const form = (
    <View style={[styles.column, twoColumns && styles.columnInRow]}>
      <TextField
        name="label"
        label="Label"
        testID="placement-label"
        value={draft.label}
        onChangeText={(label) => set({ label })}
        editable={canEdit}
        error={e.label}
        onBlur={saveNow}
      />

      <View style={styles.section}>
        <AppText variant="label">Mirror</AppText>
        <View style={styles.mirrorSummary} testID="placement-mirror-summary">
          {spec ? (
            <>
              <AppText variant="bodyStrong">{item ? item.name : `Custom ${SHAPE_LABELS[spec.shape].toLowerCase()} mirror`}</AppText>
              <AppText variant="small">{`${mirrorSizeText(spec, units)} · ${radiusText(spec, units)}`}</AppText>
            </>
          ) : (
            <AppText tone="stop">No mirror chosen yet.</AppText>
          )}
        </View>
        {canEdit ? (
          showPicker || !spec ? (
            <>
              <MirrorPicker catalogue={catalogue} units={units} value={mirrorChoice} errors={e} onChange={(choice) => set(choice)} />
              {spec ? (
                <Button label="Done choosing" testID="placement-mirror-done" variant="quiet" onPress={() => setShowPicker(false)} />
              ) : null}
            </>
          ) : (
            <Button label="Change mirror" testID="placement-mirror-change" variant="secondary" onPress={() => setShowPicker(true)} />
          )
        ) : null}
      </View>

      <NumberField
        name="heightM"
        label="Mounting height (to the mirror's centre)"
        testID="placement-height"
        units={units}
        kind="distance"
        value={draft.heightM}
        onChangeValue={(v) => v !== null && set({ heightM: v })}
        editable={canEdit}
        step={heightStep}
        min={PLACEMENT_LIMITS.heightM.min}
        max={PLACEMENT_LIMITS.heightM.max}
        error={e.heightM}
      />
      <NumberField
        name="azimuthRad"
        label="Aim (0° along the plan's x axis, 90° along y)"
        testID="placement-azimuth"
        units={units}
        kind="angle"
        value={draft.azimuthRad}
        onChangeValue={(v) => v !== null && set({ azimuthRad: v })}
        editable={canEdit}
        step={5 * DEG}
        min={PLACEMENT_LIMITS.azimuthRad.min}
        max={PLACEMENT_LIMITS.azimuthRad.max}
        error={e.azimuthRad}
      />
      <NumberField
        name="tiltDownRad"
        label="Tilt down from level"
        testID="placement-tilt"
        units={units}
        kind="angle"
        value={draft.tiltDownRad}
        onChangeValue={(v) => v !== null && set({ tiltDownRad: v })}
        editable={canEdit}
        step={1 * DEG}
        min={PLACEMENT_LIMITS.tiltDownRad.min}
        max={PLACEMENT_LIMITS.tiltDownRad.max}
        error={e.tiltDownRad}
      />
      <View style={styles.pair}>
        <View style={styles.flex}>
          <NumberField
            name="positionM.0"
            label="Position x"
            testID="placement-x"
            units={units}
            kind="distance"
            value={draft.positionM[0]}
            onChangeValue={(v) => v !== null && set({ positionM: [v, draft.positionM[1]] })}
            editable={canEdit}
            error={e['positionM.0'] ?? e.positionM}
          />
        </View>
        <View style={styles.flex}>
          <NumberField
            name="positionM.1"
            label="Position y"
            testID="placement-y"
            units={units}
            kind="distance"
            value={draft.positionM[1]}
            onChangeValue={(v) => v !== null && set({ positionM: [draft.positionM[0], v] })}
            editable={canEdit}
            error={e['positionM.1']}
          />
        </View>
      </View>

      <View style={styles.section}>
        <AppText variant="label">Serves the viewer</AppText>
        {project.scene.viewers.length === 0 ? (
          <AppText tone="muted">The plan has no viewers yet. Add the driver’s or walker’s eye point on the plan to see numbers.</AppText>
        ) : (
          <ChoiceChips
            label="Viewer this mirror serves"
            value={draft.viewerId ?? '__none'}
            disabled={!canEdit}
            onChange={(v) => set({ viewerId: v === '__none' ? null : v })}
            options={[
              ...project.scene.viewers.map((v) => ({
                value: v.id,
                label: `${v.name} (eye ${formatLength(v.eyeHeightM, units)})`,
                testID: `placement-viewer-${v.id}`,
              })),
              { value: '__none', label: 'None yet', testID: 'placement-viewer-none' },
            ]}
          />
        )}
        {e.viewerId ? <AppText tone="stop">{e.viewerId}</AppText> : null}
      </View>

      <TextField
        name="notes"
        label="Notes"
        testID="placement-notes"
        value={draft.notes}
        onChangeText={(notes) => set({ notes })}
        onBlur={saveNow}
        editable={canEdit}
        multiline
        numberOfLines={3}
        error={e.notes}
      />
    </View>
  );

  const numbers = (
    <View style={[styles.column, twoColumns && styles.columnInRow]}>
      <Card title="Live numbers">
        <PlacementNumbersPanel evaluation={live?.evaluation ?? null} zones={live?.zones ?? []} scene={project.scene} units={units} />
      </Card>
      <Card title="Side view">
        <ElevationView evaluation={live?.evaluation ?? null} units={units} />
      </Card>
      <SafetyCautions compact />
    </View>
  );

  return (
    <View style={styles.root} testID="placement-editor" onLayout={onLayout}>
      <View style={styles.head}>
        <View style={styles.flex}>
          <AppText variant="heading" role="heading" aria-level={2}>
            {draft.label}
          </AppText>
          <SaveStatus
            canEdit={canEdit}
            dirty={dirty}
            saving={writes.saving}
            error={problem?.message || null}
            conflict={Boolean(conflict)}
          />
        </View>
        {onClose ? <Button label="Close" testID="placement-close" variant="secondary" onPress={close} /> : null}
      </View>

      {conflict ? (
        <PlacementConflictNotice
          conflict={conflict}
          units={units}
          catalogue={catalogue}
          onKeepMine={() => writes.keepMine(id)}
          onUseTheirs={() => writes.useTheirs(id)}
        />
      ) : null}
      {problem?.message ? (
        <Notice tone="stop" testID="placement-error">
          {problem.message}
        </Notice>
      ) : null}

      <View style={twoColumns ? styles.columns : styles.stack}>
        {form}
        {numbers}
      </View>

      {canEdit ? (
        <View style={styles.actions}>
          <Button
            label={writes.saving ? 'Saving…' : 'Save now'}
            testID="placement-save"
            onPress={saveNow}
            disabled={!dirty || Boolean(conflict)}
            busy={writes.saving}
          />
          {confirmDelete ? (
            <View style={styles.confirm} testID="placement-delete-confirmation">
              <AppText variant="bodyStrong">{`Remove “${draft.label}” from this project? This cannot be undone.`}</AppText>
              <View style={styles.actions}>
                <Button
                  label="Remove mirror"
                  testID="placement-delete-confirm"
                  variant="danger"
                  busy={writes.removing}
                  onPress={() => {
                    setRemoveError(null);
                    writes.remove(id).then(() => onClose?.(), setRemoveError);
                  }}
                />
                <Button label="Keep it" testID="placement-delete-cancel" variant="secondary" onPress={() => setConfirmDelete(false)} />
              </View>
              {removeError ? <Notice tone="stop">{describeError(removeError)}</Notice> : null}
            </View>
          ) : (
            <Button label="Remove this mirror…" testID="placement-delete" variant="danger" onPress={() => setConfirmDelete(true)} />
          )}
        </View>
      ) : (
        <AppText tone="muted" testID="placement-read-only">
          You can read this mirror’s values; only the project’s installer can change them.
        </AppText>
      )}
    </View>
  );
}

function SaveStatus({
  canEdit,
  dirty,
  saving,
  error,
  conflict,
}: {
  canEdit: boolean;
  dirty: boolean;
  saving: boolean;
  error: string | null;
  conflict: boolean;
}) {
  if (!canEdit) return null;
  const text = saving
    ? 'Saving…'
    : conflict
      ? 'Not saved: changed elsewhere.'
      : error
        ? 'Not saved.'
        : dirty
          ? 'Unsaved changes; saving shortly.'
          : 'All changes saved.';
  return (
    <AppText variant="small" tone={error || conflict ? 'stop' : 'muted'} testID="placement-save-status" aria-live="polite">
      {text}
    </AppText>
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
  section: { gap: spacing.sm },
  mirrorSummary: { gap: spacing.xxs, padding: spacing.md, backgroundColor: palette.chalk, borderRadius: 8 },
  pair: { flexDirection: 'row', gap: spacing.md },
  flex: { flex: 1 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, alignItems: 'center' },
  confirm: {
    gap: spacing.sm,
    padding: spacing.md,
    borderWidth: 2,
    borderColor: palette.stop,
    borderRadius: 8,
    backgroundColor: palette.stopSoft,
    alignSelf: 'stretch',
  },
});
