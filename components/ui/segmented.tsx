import { Pressable, StyleSheet, View } from 'react-native';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import { AppText } from './text';

export interface SegmentOption<T extends string> {
  value: T;
  label: string;
  testID: string;
}

export interface SegmentedProps<T extends string> {
  /** Read out as the group's name. */
  label: string;
  options: readonly SegmentOption<T>[];
  value: T | undefined;
  onChange: (value: T) => void;
  disabled?: boolean;
  /** Smaller segments for a table row; still at least the minimum touch target high. */
  compact?: boolean;
  /** Fill the row, segments sharing it equally (phone layouts). */
  stretch?: boolean;
}

/** One-of-few choice (units, role) as a row of radio buttons: one tap, no menu to open. */
export function Segmented<T extends string>({ label, options, value, onChange, disabled, compact, stretch }: SegmentedProps<T>) {
  return (
    <View role="radiogroup" aria-label={label} style={[styles.group, stretch && styles.groupStretch, disabled && styles.groupDisabled]}>
      {options.map((option) => (
        <Segment
          key={option.value}
          option={option}
          selected={option.value === value}
          disabled={disabled}
          compact={compact}
          stretch={stretch}
          onSelect={() => {
            if (option.value !== value) onChange(option.value);
          }}
        />
      ))}
    </View>
  );
}

interface SegmentProps {
  option: SegmentOption<string>;
  selected: boolean;
  disabled?: boolean;
  compact?: boolean;
  stretch?: boolean;
  onSelect: () => void;
}

function Segment({ option, selected, disabled, compact, stretch, onSelect }: SegmentProps) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  return (
    <Pressable
      testID={option.testID}
      role="radio"
      aria-checked={selected}
      aria-label={option.label}
      aria-disabled={disabled}
      disabled={disabled}
      onPress={onSelect}
      onFocus={onFocus}
      onBlur={onBlur}
      style={({ hovered }) => [
        styles.segment,
        compact && styles.compact,
        stretch && styles.segmentStretch,
        hovered && !selected && styles.hovered,
        selected && styles.selected,
        focusVisible && styles.focused,
      ]}
    >
      <AppText variant="label" numberOfLines={1} style={selected ? styles.selectedText : styles.text}>
        {option.label}
      </AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  group: {
    flexDirection: 'row',
    alignSelf: 'flex-start',
    borderWidth: 2,
    borderColor: palette.asphalt,
    borderRadius: radii.md,
    overflow: 'hidden',
    backgroundColor: palette.card,
  },
  groupStretch: { alignSelf: 'stretch' },
  groupDisabled: { opacity: 0.6 },
  segmentStretch: { flex: 1, paddingHorizontal: spacing.xs },
  segment: { minHeight: layout.minTarget - 4, paddingHorizontal: spacing.lg, alignItems: 'center', justifyContent: 'center' },
  compact: { paddingHorizontal: spacing.md },
  hovered: { backgroundColor: palette.ruleSoft },
  selected: { backgroundColor: palette.asphalt },
  // Inset, because the group clips its children to its rounded border.
  focused: { ...focusRing, outlineOffset: -4, outlineColor: palette.beacon },
  text: { color: palette.asphalt },
  selectedText: { color: palette.onAsphalt },
});
