/**
 * Which of the vehicle's fields a mirror counts toward: every field (saved as null), or a list
 * the installer ticks. A list that names no field any more (rule set changed) shows as ticked
 * nothing, and scoring ignores the stale ids.
 */
import { Pressable, StyleSheet, View } from 'react-native';
import { ChoiceChips } from '@/components/placement/choice-chips';
import { AppText } from '@/components/ui/text';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import type { VehicleField } from '@/shared/vehicle';

export interface ServedFieldsChooserProps {
  fields: readonly Pick<VehicleField, 'id' | 'name'>[];
  value: readonly string[] | null;
  disabled?: boolean;
  onChange: (ids: string[] | null) => void;
}

/** The list after ticking or unticking `id`, in the fields' own order. */
export function toggleServed(fields: readonly Pick<VehicleField, 'id'>[], value: readonly string[], id: string): string[] {
  const on = new Set(value);
  if (on.has(id)) on.delete(id);
  else on.add(id);
  return fields.map((f) => f.id).filter((f) => on.has(f));
}

export function ServedFieldsChooser({ fields, value, disabled, onChange }: ServedFieldsChooserProps) {
  const mode = value === null ? 'all' : 'list';
  return (
    <View style={styles.column} testID="vehicle-serves">
      <AppText variant="label">Fields this mirror counts toward</AppText>
      <ChoiceChips<'all' | 'list'>
        label="Fields this mirror counts toward"
        value={mode}
        disabled={disabled}
        onChange={(m) => onChange(m === 'all' ? null : fields.map((f) => f.id))}
        options={[
          { value: 'all', label: 'Every field', testID: 'vehicle-serves-all' },
          { value: 'list', label: 'Only these', testID: 'vehicle-serves-list' },
        ]}
      />
      {value !== null
        ? fields.map((f) => (
            <FieldTick
              key={f.id}
              id={f.id}
              name={f.name}
              checked={value.includes(f.id)}
              disabled={disabled}
              onPress={() => onChange(toggleServed(fields, value, f.id))}
            />
          ))
        : null}
    </View>
  );
}

function FieldTick(p: { id: string; name: string; checked: boolean; disabled?: boolean; onPress: () => void }) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  return (
    <Pressable
      testID={`vehicle-serves-${p.id}`}
      role="checkbox"
      aria-checked={p.checked}
      aria-label={p.name}
      disabled={p.disabled}
      onPress={p.onPress}
      onFocus={onFocus}
      onBlur={onBlur}
      style={[styles.tick, focusVisible && focusRing]}
    >
      <View style={[styles.box, p.checked && styles.boxOn]}>{p.checked ? <AppText style={styles.mark}>✓</AppText> : null}</View>
      <AppText style={styles.grow}>{p.name}</AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.sm },
  tick: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, minHeight: layout.minTarget },
  box: {
    width: 24,
    height: 24,
    borderRadius: radii.sm,
    borderWidth: 2,
    borderColor: palette.asphalt,
    alignItems: 'center',
    justifyContent: 'center',
  },
  boxOn: { backgroundColor: palette.asphalt },
  mark: { color: palette.onAsphalt },
  grow: { flex: 1 },
});
