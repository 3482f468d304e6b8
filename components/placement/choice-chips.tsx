import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';

export interface Chip<T extends string> {
  value: T;
  label: string;
  testID: string;
}

/** One of several choices that may be too many for a segmented row (viewers): wraps onto lines. */
export function ChoiceChips<T extends string>({
  label,
  options,
  value,
  onChange,
  disabled,
}: {
  label: string;
  options: readonly Chip<T>[];
  value: T | null;
  onChange: (v: T) => void;
  disabled?: boolean;
}) {
  return (
    <View role="radiogroup" aria-label={label} style={styles.wrap}>
      {options.map((o) => (
        <ChipButton key={o.value} chip={o} selected={o.value === value} disabled={disabled} onPress={() => onChange(o.value)} />
      ))}
    </View>
  );
}

function ChipButton<T extends string>({
  chip,
  selected,
  disabled,
  onPress,
}: {
  chip: Chip<T>;
  selected: boolean;
  disabled?: boolean;
  onPress: () => void;
}) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  return (
    <Pressable
      testID={chip.testID}
      role="radio"
      aria-checked={selected}
      aria-label={chip.label}
      aria-disabled={disabled}
      disabled={disabled}
      onPress={onPress}
      onFocus={onFocus}
      onBlur={onBlur}
      style={({ hovered }) => [
        styles.chip,
        hovered && !selected && styles.hovered,
        selected && styles.selected,
        disabled && styles.disabled,
        focusVisible && focusRing,
      ]}
    >
      <AppText variant="label" style={{ color: selected ? palette.onAsphalt : palette.asphalt }}>
        {chip.label}
      </AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  wrap: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  chip: {
    minHeight: layout.minTarget,
    paddingHorizontal: spacing.lg,
    borderRadius: radii.pill,
    borderWidth: 2,
    borderColor: palette.asphalt,
    backgroundColor: palette.card,
    alignItems: 'center',
    justifyContent: 'center',
  },
  hovered: { backgroundColor: palette.ruleSoft },
  selected: { backgroundColor: palette.asphalt },
  disabled: { opacity: 0.6 },
});
