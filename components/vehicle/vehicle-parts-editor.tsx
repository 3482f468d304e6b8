/**
 * The vehicle's own parts on the vehicle screen: the drive side, the body boxes (sizes and
 * offsets with units, the schema's sentence under each field), the installer's own ground fields
 * (name, required share, corners placed on the top view) and test cylinders (name, size,
 * position, placed on the top view), each with what the mirrors make of it.
 */
import { StyleSheet, View } from 'react-native';
import { ChoiceChips } from '@/components/placement/choice-chips';
import { Button } from '@/components/ui/button';
import { NumberField } from '@/components/ui/number-field';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { palette, radii, spacing } from '@/constants/theme';
import type { VehicleEvaluation } from '@/hooks/use-vehicle-evaluation';
import type { DriverSide, Vehicle } from '@/shared/schemas/vehicle';
import { VEHICLE_LIMITS } from '@/shared/schemas/limits';
import { formatFieldShare } from '@/shared/project-optics';
import type { UnitSystem } from '@/shared/units';
import { useVehicleDraft } from './use-vehicle-draft';
import {
  addBodyBox,
  addFieldCorner,
  addGroundField,
  addTarget,
  removeBodyBox,
  removeFieldCorner,
  removeGroundField,
  removeTarget,
  updateBodyBox,
  updateGroundField,
  updateTarget,
} from './vehicle-part-edits';

/** What the next tap on the top view moves: a test cylinder, or one corner of an own field. */
export type PartPlacing = { kind: 'target'; id: string } | { kind: 'corner'; id: string; index: number } | null;

export interface VehiclePartsEditorProps {
  evaluation: VehicleEvaluation;
  canEdit: boolean;
  units: UnitSystem;
  onSaveVehicle: (v: Vehicle) => void;
  onSwitchDriveSide: (side: DriverSide) => void;
  placing: PartPlacing;
  onPlacing: (p: PartPlacing) => void;
}

const percentText = (share: number) => `${Math.round(share * 1000) / 10}`;

export function VehiclePartsEditor(p: VehiclePartsEditorProps) {
  const { draft, problems, change } = useVehicleDraft(p.evaluation.vehicle, p.onSaveVehicle);
  const { units, canEdit } = p;
  const err = (path: string) => problems.get(path);
  const scores = new Map((p.evaluation.score?.fields ?? []).map((s) => [s.field.id, s]));
  const targets = new Map((p.evaluation.score?.targets ?? []).map((t) => [t.targetId, t]));
  const dist = (
    key: string,
    label: string,
    value: number | null,
    set: (v: number | null) => void,
    opts: { size?: boolean; required?: boolean; hint?: string } = {},
  ) => (
    <NumberField
      key={key}
      name={key}
      label={label}
      testID={`vehicle-part-${key}`}
      units={units}
      kind={opts.size ? 'size' : 'distance'}
      value={value}
      editable={canEdit}
      required={opts.required ?? true}
      hint={opts.hint}
      error={err(key)}
      onChangeValue={set}
    />
  );

  return (
    <View style={styles.column} testID="vehicle-parts">
      <AppText variant="caps" role="heading" aria-level={2}>
        The vehicle
      </AppText>
      <ChoiceChips<DriverSide>
        label="Drive side"
        value={draft.driverSide}
        disabled={!canEdit}
        onChange={(s) => s !== draft.driverSide && p.onSwitchDriveSide(s)}
        options={[
          { value: 'left', label: 'Left-hand drive', testID: 'vehicle-drive-left' },
          { value: 'right', label: 'Right-hand drive', testID: 'vehicle-drive-right' },
        ]}
      />
      <AppText variant="small" tone="muted">
        Switching the drive side mirrors the whole vehicle, its mirrors and the fields they serve.
      </AppText>

      <AppText variant="label">Body parts (they block sightlines below their window line)</AppText>
      {draft.bodyBoxes.map((b, i) => {
        const set = (patch: Parameters<typeof updateBodyBox>[2]) => change((v) => updateBodyBox(v, b.id, patch));
        const k = (f: string) => `bodyBoxes.${i}.${f}`;
        return (
          <View key={b.id} style={styles.card} testID={`vehicle-box-${b.id}`}>
            <TextField
              name={k('name')}
              label="Name"
              testID={`vehicle-part-${k('name')}`}
              value={b.name}
              editable={canEdit}
              error={err(k('name'))}
              onChangeText={(name) => set({ name })}
            />
            {dist(k('frontBehindM'), 'Front, behind the vehicle front', b.frontBehindM, (x) => x !== null && set({ frontBehindM: x }))}
            {dist(k('rearBehindM'), 'Rear, behind the vehicle front', b.rearBehindM, (x) => x !== null && set({ rearBehindM: x }))}
            {dist(k('widthM'), 'Width', b.widthM, (x) => x !== null && set({ widthM: x }))}
            {dist(k('offsetM'), 'Offset of its middle toward the driver’s side', b.offsetM, (x) => x !== null && set({ offsetM: x }))}
            {dist(k('heightM'), 'Height', b.heightM, (x) => x !== null && set({ heightM: x }))}
            {dist(k('windowLineM'), 'Window line (empty: no glass)', b.windowLineM, (x) => set({ windowLineM: x }), { required: false })}
            {canEdit ? (
              <Button
                label={`Remove ${b.name}`}
                variant="quiet"
                testID={`vehicle-box-remove-${b.id}`}
                onPress={() => change((v) => removeBodyBox(v, b.id), true)}
              />
            ) : null}
          </View>
        );
      })}
      {err('bodyBoxes') ? <AppText tone="stop">{err('bodyBoxes')}</AppText> : null}
      {canEdit && draft.bodyBoxes.length < VEHICLE_LIMITS.bodyBoxes ? (
        <Button label="Add a body part" variant="secondary" testID="vehicle-box-add" onPress={() => change(addBodyBox, true)} />
      ) : null}

      <AppText variant="label">Own ground fields</AppText>
      {draft.groundFields.map((f, i) => {
        const k = (x: string) => `groundFields.${i}.${x}`;
        const s = scores.get(f.id);
        return (
          <View key={f.id} style={styles.card} testID={`vehicle-own-field-${f.id}`}>
            <AppText variant="bodyStrong" testID={`vehicle-own-field-share-${f.id}`}>
              {s ? `${formatFieldShare(s.share)} seen, needs ${formatFieldShare(f.requiredShare)}` : 'Not scored yet'}
            </AppText>
            <TextField
              name={k('name')}
              label="Name"
              testID={`vehicle-part-${k('name')}`}
              value={f.name}
              editable={canEdit}
              error={err(k('name'))}
              onChangeText={(name) => change((v) => updateGroundField(v, f.id, { name }))}
            />
            <TextField
              name={k('requiredShare')}
              label="Share that must be seen, %"
              testID={`vehicle-part-${k('requiredShare')}`}
              defaultValue={percentText(f.requiredShare)}
              editable={canEdit}
              inputMode="decimal"
              error={err(k('requiredShare'))}
              onChangeText={(t) => {
                const pct = Number(t.replace(',', '.').replace('%', '').trim());
                if (t.trim() !== '' && Number.isFinite(pct)) change((v) => updateGroundField(v, f.id, { requiredShare: pct / 100 }));
              }}
            />
            <ChoiceChips<'both' | 'one'>
              label="Which eye counts"
              value={f.eyes}
              disabled={!canEdit}
              onChange={(eyes) => change((v) => updateGroundField(v, f.id, { eyes }), true)}
              options={[
                { value: 'both', label: 'Either eye', testID: `vehicle-own-field-eyes-both-${f.id}` },
                { value: 'one', label: 'One eye point', testID: `vehicle-own-field-eyes-one-${f.id}` },
              ]}
            />
            <AppText variant="small" tone="muted">
              Pick a corner, then tap the top view where it goes.
            </AppText>
            <View style={styles.row}>
              {f.polygonM.map((_, ci) => {
                const on = p.placing?.kind === 'corner' && p.placing.id === f.id && p.placing.index === ci;
                return (
                  <Button
                    key={ci}
                    label={`Corner ${ci + 1}`}
                    variant={on ? 'primary' : 'secondary'}
                    disabled={!canEdit}
                    testID={`vehicle-own-field-corner-${f.id}-${ci}`}
                    onPress={() => p.onPlacing(on ? null : { kind: 'corner', id: f.id, index: ci })}
                  />
                );
              })}
            </View>
            {err(k('polygonM')) ? <AppText tone="stop">{err(k('polygonM'))}</AppText> : null}
            {canEdit ? (
              <View style={styles.row}>
                <Button
                  label="Add a corner"
                  variant="quiet"
                  testID={`vehicle-own-field-add-corner-${f.id}`}
                  onPress={() => change((v) => addFieldCorner(v, f.id, f.polygonM.length - 1), true)}
                />
                <Button
                  label="Remove the last corner"
                  variant="quiet"
                  testID={`vehicle-own-field-remove-corner-${f.id}`}
                  onPress={() => change((v) => removeFieldCorner(v, f.id, f.polygonM.length - 1), true)}
                />
                <Button
                  label={`Remove ${f.name}`}
                  variant="quiet"
                  testID={`vehicle-own-field-remove-${f.id}`}
                  onPress={() => change((v) => removeGroundField(v, f.id), true)}
                />
              </View>
            ) : null}
          </View>
        );
      })}
      {canEdit && draft.groundFields.length < VEHICLE_LIMITS.groundFields ? (
        <Button
          label="Add a ground field"
          variant="secondary"
          testID="vehicle-own-field-add"
          onPress={() => change(addGroundField, true)}
        />
      ) : null}

      <AppText variant="label">Test cylinders</AppText>
      {draft.targets.map((t, i) => {
        const k = (x: string) => `targets.${i}.${x}`;
        const view = targets.get(t.id);
        const set = (patch: Parameters<typeof updateTarget>[2]) => change((v) => updateTarget(v, t.id, patch));
        const placingThis = p.placing?.kind === 'target' && p.placing.id === t.id;
        return (
          <View key={t.id} style={styles.card} testID={`vehicle-cylinder-${t.id}`}>
            <AppText variant="bodyStrong" testID={`vehicle-cylinder-seen-${t.id}`}>
              {view
                ? view.visible
                  ? view.passes
                    ? 'Seen, meets its image rule'
                    : 'Seen, misses its image rule'
                  : 'Not seen'
                : 'Not scored yet'}
            </AppText>
            <TextField
              name={k('name')}
              label="Name"
              testID={`vehicle-part-${k('name')}`}
              value={t.name}
              editable={canEdit}
              error={err(k('name'))}
              onChangeText={(name) => set({ name })}
            />
            {dist(k('diameterM'), 'Diameter', t.diameterM, (x) => x !== null && set({ diameterM: x }), { size: true })}
            {dist(k('heightM'), 'Height', t.heightM, (x) => x !== null && set({ heightM: x }))}
            {dist(
              k('positionM.0'),
              'Ahead of the front bumper (behind it: negative)',
              t.positionM[0],
              (x) => x !== null && set({ positionM: [x, t.positionM[1]] }),
            )}
            {dist(
              k('positionM.1'),
              'Left of the centreline (right of it: negative)',
              t.positionM[1],
              (y) => y !== null && set({ positionM: [t.positionM[0], y] }),
            )}
            {canEdit ? (
              <View style={styles.row}>
                <Button
                  label={placingThis ? 'Tap the top view…' : 'Place on the top view'}
                  variant={placingThis ? 'primary' : 'secondary'}
                  testID={`vehicle-cylinder-place-${t.id}`}
                  onPress={() => p.onPlacing(placingThis ? null : { kind: 'target', id: t.id })}
                />
                <Button
                  label={`Remove ${t.name}`}
                  variant="quiet"
                  testID={`vehicle-cylinder-remove-${t.id}`}
                  onPress={() => change((v) => removeTarget(v, t.id), true)}
                />
              </View>
            ) : null}
          </View>
        );
      })}
      {canEdit && draft.targets.length < VEHICLE_LIMITS.targets ? (
        <Button label="Add a test cylinder" variant="secondary" testID="vehicle-cylinder-add" onPress={() => change(addTarget, true)} />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.md },
  card: { gap: spacing.sm, padding: spacing.md, borderRadius: radii.md, borderWidth: 1, borderColor: palette.rule },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
