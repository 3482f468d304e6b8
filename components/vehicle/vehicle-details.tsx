/**
 * A vehicle job's details: the planning line and the cautions first (never below a control that
 * could hide them), the rule set, the selected mirror (class, height, tilt, aim, its numbers and
 * side view), the vehicle from the side, the fields with their verdicts, and the sheet.
 */
import { StyleSheet, View } from 'react-native';
import { ChoiceChips } from '@/components/placement/choice-chips';
import { ElevationView } from '@/components/placement/elevation-view';
import { PlacementNumbersPanel } from '@/components/placement/numbers-panel';
import { SheetActions } from '@/components/sheet';
import { PhotoGallery } from '@/components/uploads/photo-gallery';
import { Notice } from '@/components/ui/notice';
import { NumberField } from '@/components/ui/number-field';
import { SafetyCautions } from '@/components/ui/safety-cautions';
import { AppText } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { spacing } from '@/constants/theme';
import type { VehicleEvaluation, VehiclePlacement } from '@/hooks/use-vehicle-evaluation';
import type { EditableFields } from '@/hooks/use-placement-writes';
import type { MirrorClass, Scene } from '@/shared/schemas';
import type { DriverSide, Vehicle } from '@/shared/schemas/vehicle';
import type { UnitSystem } from '@/shared/units';
import { RULE_SETS, type RuleSetId } from '@/shared/vehicle';
import { MIRROR_CLASS_ORDER, MIRROR_TEMPLATES } from './vehicle-mirrors';
import { VehicleFieldList } from './vehicle-field-list';
import { VehicleSideView } from './vehicle-side-view';
import { VehiclePartsEditor, type PartPlacing } from './vehicle-parts-editor';
import { ServedFieldsChooser } from './served-fields-chooser';
import { KIND_LABELS, PLANNING_LINE, RULE_SET_ORDER, RULE_SET_SHORT } from './vehicle-words';

/** The planning line and the four cautions: together wherever vehicle fields are shown. */
export function VehicleCautions() {
  return (
    <View style={styles.cautions} testID="vehicle-cautions">
      <AppText variant="bodyStrong" testID="vehicle-planning-line">
        {PLANNING_LINE}
      </AppText>
      <SafetyCautions compact />
    </View>
  );
}

const EMPTY_SCENE: Scene = { walls: [], zones: [], viewers: [] };

export interface VehicleDetailsProps {
  projectId: number;
  canEdit: boolean;
  evaluation: VehicleEvaluation;
  placements: readonly VehiclePlacement[];
  selectedId: number | null;
  units: UnitSystem;
  onRuleSet: (r: RuleSetId) => void;
  onChangeMirror: (id: number, patch: Partial<EditableFields>, autosaveMs?: number) => void;
  onDeleteMirror: (id: number) => void;
  onDeselect: () => void;
  onSaveVehicle: (v: Vehicle) => void;
  onSwitchDriveSide: (side: DriverSide) => void;
  placing: PartPlacing;
  onPlacing: (p: PartPlacing) => void;
}

export function VehicleDetails(p: VehicleDetailsProps) {
  const { evaluation, units } = p;
  const selected = p.placements.find((x) => x.id === p.selectedId);
  const v = evaluation.vehicle;
  return (
    <View style={styles.column} testID="vehicle-details">
      <VehicleCautions />
      {evaluation.problem ? (
        <Notice tone="stop" testID="vehicle-problem">
          {evaluation.problem}
        </Notice>
      ) : null}
      {selected ? (
        <>
          <MirrorEditor {...p} placement={selected} />
          <View style={styles.section}>
            <AppText variant="caps" role="heading" aria-level={3}>
              Photos of this mirror as mounted
            </AppText>
            <PhotoGallery projectId={p.projectId} placementId={selected.id} canEdit={p.canEdit} testID="placement-photos" />
          </View>
        </>
      ) : (
        <AppText tone="muted" testID="vehicle-hint">
          {p.placements.length === 0
            ? 'No mirrors yet. Choose Add mirror, pick its class and tap the body where it hangs.'
            : 'Tap a mirror to move it, turn its handle to aim it, or change its height and tilt here.'}
        </AppText>
      )}
      <View style={styles.section}>
        <AppText variant="caps" role="heading" aria-level={2}>
          Rule the mirrors are checked against
        </AppText>
        <ChoiceChips<RuleSetId>
          label="Rule the mirrors are checked against"
          value={evaluation.ruleSet}
          disabled={!p.canEdit}
          onChange={p.onRuleSet}
          options={RULE_SET_ORDER.map((r) => ({ value: r, label: RULE_SET_SHORT[r], testID: `vehicle-rule-${r}` }))}
        />
        <AppText
          variant="small"
          tone="muted"
        >{`${RULE_SETS[evaluation.ruleSet].title}: ${RULE_SETS[evaluation.ruleSet].description}`}</AppText>
      </View>
      <VehicleFieldList evaluation={evaluation} />
      <VehicleSideView evaluation={evaluation} placements={p.placements} selectedId={p.selectedId} units={units} />
      <VehiclePartsEditor
        evaluation={evaluation}
        canEdit={p.canEdit}
        units={units}
        onSaveVehicle={p.onSaveVehicle}
        onSwitchDriveSide={p.onSwitchDriveSide}
        placing={p.placing}
        onPlacing={p.onPlacing}
      />
      <AppText variant="small" tone="muted" testID="vehicle-summary">
        {`${KIND_LABELS[v.kind]}, ${v.driverSide === 'left' ? 'left' : 'right'}-hand drive, ${v.lengthM} m long and ${v.widthM} m wide.`}
      </AppText>
      <View style={styles.section}>
        <AppText variant="caps" role="heading" aria-level={2}>
          Photos of the job
        </AppText>
        <PhotoGallery projectId={p.projectId} placementId={null} canEdit={p.canEdit} testID="job-photos" />
      </View>
      <SheetActions projectId={p.projectId} canEdit={p.canEdit} />
    </View>
  );
}

function MirrorEditor(p: VehicleDetailsProps & { placement: VehiclePlacement }) {
  const m = p.placement;
  const ev = p.evaluation.mirrors.get(m.id) ?? null;
  const change = (patch: Partial<EditableFields>, autosaveMs?: number) => p.onChangeMirror(m.id, patch, autosaveMs);
  const cls = m.mirrorClass;
  return (
    <View style={styles.section} testID="vehicle-mirror-editor">
      <View style={styles.titleRow}>
        <AppText variant="heading" style={styles.grow} testID="vehicle-mirror-title">
          {`Mirror ${m.label}${cls ? ` · ${MIRROR_TEMPLATES[cls].name.toLowerCase()} (class ${cls})` : ''}`}
        </AppText>
        <Button label="Done" variant="quiet" testID="vehicle-mirror-done" onPress={p.onDeselect} />
      </View>
      <ChoiceChips<MirrorClass>
        label="Fitted as class"
        value={cls ?? null}
        disabled={!p.canEdit}
        onChange={(c) => change({ mirrorClass: c })}
        options={MIRROR_CLASS_ORDER.map((c) => ({ value: c, label: `Class ${c}`, testID: `vehicle-mirror-class-${c}` }))}
      />
      <NumberField
        name="heightM"
        label="Height of its centre above the ground"
        testID="vehicle-mirror-height"
        units={p.units}
        kind="distance"
        value={m.heightM}
        editable={p.canEdit}
        step={0.05}
        onChangeValue={(v) => v !== null && change({ heightM: v }, 900)}
      />
      <NumberField
        name="tiltDownRad"
        label="Tilt down from level"
        testID="vehicle-mirror-tilt"
        units={p.units}
        kind="angle"
        value={m.tiltDownRad}
        editable={p.canEdit}
        step={Math.PI / 90}
        onChangeValue={(v) => v !== null && change({ tiltDownRad: v }, 900)}
      />
      <ServedFieldsChooser
        fields={p.evaluation.fields}
        value={m.servesFieldIds ?? null}
        disabled={!p.canEdit}
        onChange={(servesFieldIds) => change({ servesFieldIds })}
      />
      {ev ? <PlacementNumbersPanel evaluation={ev} zones={[]} scene={EMPTY_SCENE} units={p.units} /> : null}
      {ev ? <ElevationView evaluation={ev} units={p.units} testID="vehicle-mirror-elevation" /> : null}
      {p.canEdit ? (
        <Button label="Remove this mirror" variant="danger" testID="vehicle-mirror-delete" onPress={() => p.onDeleteMirror(m.id)} />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
  cautions: { gap: spacing.sm },
  section: { gap: spacing.sm },
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  grow: { flex: 1 },
});
