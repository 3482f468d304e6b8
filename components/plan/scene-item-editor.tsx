/**
 * The editor for a selected zone, viewer, wall or racking run: its name (a Formik form checked by
 * the shared label rule), its target or eye height or height and kind, and for a zone its corners
 * (remove one, or add one in the middle of an edge, then drag it on the plan). Every change is a
 * scene edit (scene-edits.ts) handed to `onEdit`, which checks the whole scene and saves it.
 */
import { Formik } from 'formik';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import * as yup from 'yup';
import { FormikTextField } from '@/components/forms/formik-text-field';
import { yupText } from '@/components/forms/yup-rules';
import { AppText, Button, Segmented } from '@/components/ui';
import { NumberField } from '@/components/ui/number-field';
import { palette, radii, spacing } from '@/constants/theme';
import { labelRule, wallKinds, type Scene, type SceneWall, type ZoneTarget } from '@/shared/schemas';
import { TARGET_HEIGHT_M } from '@/shared/project-optics';
import { formatLength, type UnitSystem } from '@/shared/units';
import type { PlanSelection } from './plan-types';
import {
  insertZoneCorner,
  MIN_ZONE_CORNERS,
  removeZoneCorner,
  renameViewer,
  renameZone,
  setViewerEyeHeight,
  setWallHeight,
  setWallKind,
  setZoneTarget,
} from './scene-edits';

export interface SceneItemEditorProps {
  scene: Scene;
  selection: PlanSelection;
  units: UnitSystem;
  /** Checks and saves the edited scene; returns the sentence when it cannot be saved. */
  onEdit: (next: Scene) => string | null;
}

const WALL_WORDS: Record<SceneWall['kind'], string> = { wall: 'Wall', racking: 'Racking', door: 'Doorway' };

export function SceneItemEditor(p: SceneItemEditorProps) {
  const sel = p.selection;
  if (!sel || sel.kind === 'placement') return null;
  const item =
    sel.kind === 'zone'
      ? p.scene.zones.find((z) => z.id === sel.id)
      : sel.kind === 'viewer'
        ? p.scene.viewers.find((v) => v.id === sel.id)
        : p.scene.walls.find((w) => w.id === sel.id);
  if (!item) return null;
  return (
    <View style={styles.card} testID="scene-item-editor">
      <AppText variant="label">Change it</AppText>
      {sel.kind !== 'wall' && 'name' in item ? (
        <NameForm
          key={`${sel.kind}-${sel.id}`}
          what={sel.kind}
          name={item.name}
          onRename={(name) => p.onEdit(sel.kind === 'zone' ? renameZone(p.scene, sel.id, name) : renameViewer(p.scene, sel.id, name))}
        />
      ) : null}
      {sel.kind === 'zone' ? <ZoneFields {...p} id={sel.id} /> : null}
      {sel.kind === 'viewer' && 'eyeHeightM' in item ? (
        <SavedNumber
          name="eyeHeight"
          label="Eye height above the floor"
          testID="viewer-eye-height"
          units={p.units}
          kind="size"
          value={item.eyeHeightM}
          onSave={(v) => p.onEdit(setViewerEyeHeight(p.scene, sel.id, v))}
        />
      ) : null}
      {sel.kind === 'wall' && 'heightM' in item ? <WallFields {...p} wall={item} /> : null}
    </View>
  );
}

function NameForm({ what, name, onRename }: { what: 'zone' | 'viewer'; name: string; onRename: (name: string) => string | null }) {
  const schema = yup.object({ name: yupText(labelRule(what)).required(labelRule(what).required) });
  return (
    <Formik
      initialValues={{ name }}
      enableReinitialize
      validationSchema={schema}
      onSubmit={(values, helpers) => {
        const problem = onRename(values.name.trim());
        if (problem) helpers.setFieldError('name', problem);
      }}
    >
      {(form) => (
        <View style={styles.row}>
          <View style={styles.grow}>
            <FormikTextField
              form={form}
              name="name"
              label={what === 'zone' ? 'Zone name' : 'Viewer name'}
              testID={`${what}-name`}
              selectTextOnFocus
              onSubmitEditing={() => form.handleSubmit()}
            />
          </View>
          <Button
            label="Rename"
            variant="secondary"
            testID={`${what}-rename`}
            onPress={() => form.handleSubmit()}
            disabled={form.values.name.trim() === name}
          />
        </View>
      )}
    </Formik>
  );
}

type TargetKind = ZoneTarget['kind'];

function ZoneFields(p: SceneItemEditorProps & { id: string }) {
  const zone = p.scene.zones.find((z) => z.id === p.id);
  if (!zone) return null;
  const ring = zone.polygonM;
  const onTarget = (kind: TargetKind) =>
    p.onEdit(
      setZoneTarget(
        p.scene,
        zone.id,
        kind === 'custom' ? { kind, heightM: zone.target.kind === 'custom' ? zone.target.heightM : TARGET_HEIGHT_M.adult } : { kind },
      ),
    );
  return (
    <>
      <Segmented<TargetKind>
        label="Who must be seen here"
        value={zone.target.kind}
        stretch
        onChange={onTarget}
        options={[
          { value: 'adult', label: 'Standing adult', testID: 'zone-target-adult' },
          { value: 'child', label: 'Child', testID: 'zone-target-child' },
          { value: 'custom', label: 'Own height', testID: 'zone-target-custom' },
        ]}
      />
      {zone.target.kind === 'custom' ? (
        <SavedNumber
          name="targetHeight"
          label="Height of the person to be seen"
          testID="zone-target-height"
          units={p.units}
          kind="size"
          value={zone.target.heightM}
          onSave={(v) => p.onEdit(setZoneTarget(p.scene, zone.id, { kind: 'custom', heightM: v }))}
        />
      ) : null}
      <AppText variant="small" tone="muted">
        Drag a corner’s square on the plan to move it. Add a corner in the middle of an edge, then drag it into place.
      </AppText>
      <View role="list" style={styles.corners}>
        {ring.map((pt, i) => {
          const next = ring[(i + 1) % ring.length];
          const mid: [number, number] = [
            Math.round(((pt[0] + next[0]) / 2) * 1000) / 1000,
            Math.round(((pt[1] + next[1]) / 2) * 1000) / 1000,
          ];
          return (
            <View role="listitem" key={i} style={styles.cornerRow} testID={`zone-corner-${i}`}>
              <AppText
                variant="small"
                style={styles.grow}
              >{`Corner ${i + 1}: ${formatLength(pt[0], p.units)}, ${formatLength(pt[1], p.units)}`}</AppText>
              <Button
                label="Add after"
                variant="quiet"
                testID={`zone-corner-add-${i}`}
                accessibilityLabel={`Add a corner between corner ${i + 1} and corner ${((i + 1) % ring.length) + 1}`}
                onPress={() => p.onEdit(insertZoneCorner(p.scene, zone.id, i, mid))}
              />
              <Button
                label="Remove"
                variant="quiet"
                testID={`zone-corner-remove-${i}`}
                accessibilityLabel={`Remove corner ${i + 1}`}
                disabled={ring.length <= MIN_ZONE_CORNERS}
                onPress={() => p.onEdit(removeZoneCorner(p.scene, zone.id, i))}
              />
            </View>
          );
        })}
      </View>
    </>
  );
}

function WallFields(p: SceneItemEditorProps & { wall: SceneWall }) {
  const { wall } = p;
  return (
    <>
      <Segmented<SceneWall['kind']>
        label="What it is"
        value={wall.kind}
        stretch
        onChange={(k) => p.onEdit(setWallKind(p.scene, wall.id, k))}
        options={wallKinds.map((k) => ({ value: k, label: WALL_WORDS[k], testID: `wall-kind-${k}` }))}
      />
      <SavedNumber
        name="wallHeight"
        label="Height"
        testID="wall-height"
        units={p.units}
        kind="size"
        value={wall.heightM}
        onSave={(v) => p.onEdit(setWallHeight(p.scene, wall.id, v))}
      />
      <AppText variant="small" tone="muted">
        Drag either end’s square on the plan to move it.
      </AppText>
    </>
  );
}

/** A length field that saves when it is left (not on every keystroke: one undo step per change), with the save's sentence below it. */
function SavedNumber(p: {
  name: string;
  label: string;
  testID: string;
  units: UnitSystem;
  kind: 'size';
  value: number;
  onSave: (v: number) => string | null;
}) {
  const [draft, setDraft] = useState<number | null>(p.value);
  const [error, setError] = useState<string | undefined>(undefined);
  const [shown, setShown] = useState(p.value);
  if (shown !== p.value) {
    // The saved value changed (an undo, another save): show it.
    setShown(p.value);
    setDraft(p.value);
  }
  return (
    <NumberField
      name={p.name}
      label={p.label}
      testID={p.testID}
      units={p.units}
      kind={p.kind}
      value={draft}
      error={error}
      required
      onChangeValue={(v) => {
        setDraft(v);
        setError(undefined);
      }}
      onCommitted={() => {
        if (draft === null || draft === p.value) return;
        setError(p.onSave(draft) ?? undefined);
      }}
    />
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: palette.card,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: palette.rule,
    padding: spacing.md,
    gap: spacing.md,
  },
  row: { flexDirection: 'row', gap: spacing.sm, alignItems: 'flex-end' },
  grow: { flexGrow: 1, flexShrink: 1 },
  corners: { gap: spacing.xs },
  cornerRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
});
