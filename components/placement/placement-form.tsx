/**
 * The mirror mount's fields: label, mirror, height, aim, tilt, position, viewer and notes. It holds
 * no copy of the values: it shows the plan's live placement and reports each change at once.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { NumberField } from '@/components/ui/number-field';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { palette, spacing } from '@/constants/theme';
import type { PlacementEdits } from '@/hooks/use-placement-writes';
import type { CatalogueItemDto, PlacementDto, SceneViewer } from '@/shared/schemas';
import { PLACEMENT_LIMITS } from '@/shared/schemas/limits';
import { mountingHeightRule, planCoordinateRule } from '@/shared/schemas/rules';
import { formatLength, type UnitSystem } from '@/shared/units';
import { ChoiceChips } from './choice-chips';
import { MirrorPicker, type MirrorChoice } from './mirror-picker';
import { mirrorSizeText, radiusText, SHAPE_LABELS } from './mirror-text';

const DEG = Math.PI / 180;
const NO_VIEWER = '__none';

export interface PlacementFormProps {
  /** The plan's live placement (saved values with the unsaved edits on top). */
  placement: PlacementDto;
  /** The plan's viewers, unsaved ones included. */
  viewers: readonly SceneViewer[];
  catalogue: readonly CatalogueItemDto[];
  units: UnitSystem;
  canEdit: boolean;
  /** The server's sentence per field from the last refused save. */
  errors: Record<string, string>;
  onChange: (patch: PlacementEdits) => void;
  /** Leaving a text field: save now rather than wait. */
  onCommit: () => void;
}

export function PlacementForm({ placement, viewers, catalogue, units, canEdit, errors: e, onChange: set, onCommit }: PlacementFormProps) {
  const [showPicker, setShowPicker] = useState(false);
  const item = placement.catalogueItemId !== null ? (catalogue.find((c) => c.id === placement.catalogueItemId) ?? null) : null;
  const spec = placement.customMirror ?? item?.mirror ?? null;
  const mirrorChoice: MirrorChoice = placement.customMirror
    ? { catalogueItemId: null, customMirror: placement.customMirror }
    : { catalogueItemId: placement.catalogueItemId ?? -1, customMirror: null };
  const heightStep = units === 'metric' ? 0.05 : 2 * 0.0254;

  return (
    <>
      <TextField
        name="label"
        label="Label"
        testID="placement-label"
        value={placement.label}
        onChangeText={(label) => set({ label })}
        editable={canEdit}
        error={e.label}
        onBlur={onCommit}
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
        value={placement.heightM}
        onChangeValue={(v) => v !== null && set({ heightM: v })}
        editable={canEdit}
        step={heightStep}
        min={PLACEMENT_LIMITS.heightM.min}
        max={PLACEMENT_LIMITS.heightM.max}
        rule={mountingHeightRule(units)}
        error={e.heightM}
      />
      <NumberField
        name="azimuthRad"
        label="Aim (0° along the plan's x axis, 90° along y)"
        testID="placement-azimuth"
        units={units}
        kind="angle"
        value={placement.azimuthRad}
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
        value={placement.tiltDownRad}
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
            value={placement.positionM[0]}
            onChangeValue={(v) => v !== null && set({ positionM: [v, placement.positionM[1]] })}
            editable={canEdit}
            rule={planCoordinateRule(units)}
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
            value={placement.positionM[1]}
            onChangeValue={(v) => v !== null && set({ positionM: [placement.positionM[0], v] })}
            editable={canEdit}
            rule={planCoordinateRule(units)}
            error={e['positionM.1']}
          />
        </View>
      </View>

      <View style={styles.section}>
        <AppText variant="label">Serves the viewer</AppText>
        {viewers.length === 0 ? (
          <AppText tone="muted">The plan has no viewers yet. Add the driver’s or walker’s eye point on the plan to see numbers.</AppText>
        ) : (
          <ChoiceChips
            label="Viewer this mirror serves"
            value={placement.viewerId ?? NO_VIEWER}
            disabled={!canEdit}
            onChange={(v) => set({ viewerId: v === NO_VIEWER ? null : v })}
            options={[
              ...viewers.map((v) => ({
                value: v.id,
                label: `${v.name} (eye ${formatLength(v.eyeHeightM, units)})`,
                testID: `placement-viewer-${v.id}`,
              })),
              { value: NO_VIEWER, label: 'None yet', testID: 'placement-viewer-none' },
            ]}
          />
        )}
        {e.viewerId ? <AppText tone="stop">{e.viewerId}</AppText> : null}
      </View>

      <TextField
        name="notes"
        label="Notes"
        testID="placement-notes"
        value={placement.notes}
        onChangeText={(notes) => set({ notes })}
        onBlur={onCommit}
        editable={canEdit}
        multiline
        numberOfLines={3}
        error={e.notes}
      />
    </>
  );
}

const styles = StyleSheet.create({
  section: { gap: spacing.sm },
  mirrorSummary: { gap: spacing.xxs, padding: spacing.md, backgroundColor: palette.chalk, borderRadius: 8 },
  pair: { flexDirection: 'row', gap: spacing.md },
  flex: { flex: 1 },
});
