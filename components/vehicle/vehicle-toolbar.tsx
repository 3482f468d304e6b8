/**
 * The vehicle view's tools at the bottom of the top view (thumb reach): Add mirror (with its class
 * while adding) and Remove for the selected mirror. Read-only viewers get a note instead.
 */
import { StyleSheet, View } from 'react-native';
import { ChoiceChips } from '@/components/placement/choice-chips';
import { ReadOnlyLines } from '@/components/plan/plan-toolbar';
import { AppText, Button } from '@/components/ui';
import { palette, radii, shadow, spacing } from '@/constants/theme';
import type { MirrorClass } from '@/shared/schemas';
import { MIRROR_CLASS_ORDER, MIRROR_TEMPLATES } from './vehicle-mirrors';

export interface VehicleToolbarProps {
  canEdit: boolean;
  adding: boolean;
  onAdding: (adding: boolean) => void;
  addClass: MirrorClass;
  onAddClass: (c: MirrorClass) => void;
  canDelete: boolean;
  onDelete: () => void;
}

export function VehicleToolbar(p: VehicleToolbarProps) {
  if (!p.canEdit) {
    return (
      <View style={styles.bar} testID="vehicle-read-only" role="note">
        <ReadOnlyLines hint="Pan, zoom and tap a mirror to see its numbers." />
      </View>
    );
  }
  return (
    <View style={styles.bar} testID="vehicle-toolbar">
      {p.adding ? (
        <>
          <AppText variant="small" testID="vehicle-tool-hint">
            {`Tap the body where the ${MIRROR_TEMPLATES[p.addClass].name.toLowerCase()} mirror hangs.`}
          </AppText>
          <ChoiceChips<MirrorClass>
            label="Class of the new mirror"
            value={p.addClass}
            onChange={p.onAddClass}
            options={MIRROR_CLASS_ORDER.filter((c) => c !== 'III').map((c) => ({
              value: c,
              label: `${MIRROR_TEMPLATES[c].name} ${c}`,
              testID: `vehicle-add-class-${c}`,
            }))}
          />
        </>
      ) : null}
      <View style={styles.row}>
        <Button
          label={p.adding ? 'Cancel' : 'Add mirror'}
          variant={p.adding ? 'secondary' : 'primary'}
          testID="vehicle-add-mirror"
          onPress={() => p.onAdding(!p.adding)}
          style={styles.grow}
        />
        {p.canDelete && !p.adding ? <Button label="Remove" variant="danger" testID="vehicle-delete" onPress={p.onDelete} /> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    gap: spacing.sm,
    padding: spacing.sm,
    borderRadius: radii.md,
    borderWidth: 2,
    borderColor: palette.asphalt,
    backgroundColor: palette.card,
    ...shadow,
  },
  row: { flexDirection: 'row', gap: spacing.sm },
  grow: { flex: 1 },
});
