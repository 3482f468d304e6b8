import { ActivityIndicator, Pressable, StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import type { ReactNode } from 'react';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { AppText } from './text';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'quiet';

export interface ButtonProps {
  label: string;
  onPress: () => void;
  testID: string;
  variant?: ButtonVariant;
  /** Spoken instead of the label when the label alone is ambiguous (e.g. "Disable" in a table row). */
  accessibilityLabel?: string;
  disabled?: boolean;
  /** Shows a spinner and ignores presses while a request is in flight. */
  busy?: boolean;
  icon?: ReactNode;
  style?: StyleProp<ViewStyle>;
  /** Full width on a phone so the thumb finds it. */
  block?: boolean;
}

export function Button({
  label,
  onPress,
  testID,
  variant = 'primary',
  accessibilityLabel,
  disabled,
  busy,
  icon,
  style,
  block,
}: ButtonProps) {
  const inactive = Boolean(disabled || busy);
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  return (
    <Pressable
      testID={testID}
      role="button"
      aria-label={accessibilityLabel ?? label}
      aria-disabled={inactive}
      aria-busy={Boolean(busy)}
      disabled={inactive}
      onPress={onPress}
      onFocus={onFocus}
      onBlur={onBlur}
      style={({ pressed, hovered }) => [
        styles.base,
        variantStyles[variant],
        block && styles.block,
        (pressed || hovered) && !inactive && pressedStyles[variant],
        inactive && styles.inactive,
        focusVisible && styles.focused,
        style,
      ]}
    >
      <View style={styles.row}>
        {busy ? <ActivityIndicator size="small" color={variant === 'primary' ? palette.asphalt : palette.glass} /> : icon}
        <AppText variant="label" style={labelStyles[variant]}>
          {label}
        </AppText>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: layout.minTarget,
    paddingHorizontal: spacing.xl,
    borderRadius: radii.md,
    borderWidth: 2,
    alignItems: 'center',
    justifyContent: 'center',
  },
  block: { alignSelf: 'stretch' },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  inactive: { opacity: 0.55 },
  focused: focusRing,
});

const variantStyles = StyleSheet.create({
  primary: { backgroundColor: palette.beacon, borderColor: palette.asphalt },
  secondary: { backgroundColor: palette.card, borderColor: palette.asphalt },
  danger: { backgroundColor: palette.card, borderColor: palette.stop },
  quiet: { backgroundColor: 'transparent', borderColor: 'transparent', paddingHorizontal: spacing.md },
});

const pressedStyles = StyleSheet.create({
  primary: { backgroundColor: palette.beaconPressed },
  secondary: { backgroundColor: palette.ruleSoft },
  danger: { backgroundColor: palette.stopSoft },
  quiet: { backgroundColor: palette.glassSoft },
});

const labelStyles = StyleSheet.create({
  primary: { color: palette.asphalt },
  secondary: { color: palette.asphalt },
  danger: { color: palette.stop },
  quiet: { color: palette.glass },
});
