import { Pressable, StyleSheet, View } from 'react-native';
import { layout, palette, radii, shadow, spacing } from '@/constants/theme';
import { AppText } from '@/components/ui';

/** Zoom in / out / fit, stacked at the top right, clear of the tools and the sheet below. */
export function ZoomControls({ onZoomIn, onZoomOut, onFit }: { onZoomIn: () => void; onZoomOut: () => void; onFit: () => void }) {
  return (
    <View style={styles.stack} pointerEvents="box-none">
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
