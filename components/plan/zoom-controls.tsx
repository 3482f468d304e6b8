import { Pressable, StyleSheet, View } from 'react-native';
import { layout, palette, radii, shadow, spacing } from '@/constants/theme';
import { AppText } from '@/components/ui';

/**
 * Zoom in / out / fit on the right: stacked at the top on a wide screen; on a phone a row low down,
 * within reach of the thumb, above the floating tools.
 */
export function ZoomControls({
  onZoomIn,
  onZoomOut,
  onFit,
  atBottom,
}: {
  onZoomIn: () => void;
  onZoomOut: () => void;
  onFit: () => void;
  /** Pixels from the plan's bottom edge for the phone's row (clear of the floating tools), or undefined for the wide stack. */
  atBottom?: number;
}) {
  return (
    <View style={[styles.stack, atBottom !== undefined && [styles.row, { bottom: atBottom }]]} pointerEvents="box-none">
      <ZoomButton label="+" a11y="Zoom in" testID="plan-zoom-in" onPress={onZoomIn} />
      <ZoomButton label="−" a11y="Zoom out" testID="plan-zoom-out" onPress={onZoomOut} />
      <ZoomButton label="Fit" a11y="Fit the whole plan" testID="plan-fit" onPress={onFit} />
    </View>
  );
}

function ZoomButton({ label, a11y, testID, onPress }: { label: string; a11y: string; testID: string; onPress: () => void }) {
  return (
    <Pressable
      testID={testID}
      role="button"
      aria-label={a11y}
      onPress={onPress}
      style={({ pressed, hovered }) => [styles.button, (pressed || hovered) && styles.pressed]}
    >
      <AppText variant="label">{label}</AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  stack: { position: 'absolute', top: spacing.sm, right: spacing.sm, gap: spacing.sm },
  row: { top: 'auto', flexDirection: 'row' },
  button: {
    width: layout.minTarget,
    height: layout.minTarget,
    borderRadius: radii.md,
    borderWidth: 2,
    borderColor: palette.asphalt,
    backgroundColor: palette.card,
    alignItems: 'center',
    justifyContent: 'center',
    ...shadow,
  },
  pressed: { backgroundColor: palette.ruleSoft },
});
