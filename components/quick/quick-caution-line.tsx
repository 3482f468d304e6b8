/**
 * The caution that travels with the ranked answers: on a phone the four cautions under the list
 * are a long scroll away from the first answers, so a short line heads the list (always whole,
 * never cut), and one tap opens the four sentences right there.
 */
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui';
import { SafetyCautions } from '@/components/ui/safety-cautions';
import { palette, radii, spacing } from '@/constants/theme';

/** The first caution in a few words, and where the others are. */
export const QUICK_SHORT_CAUTION = 'Mirrors show things smaller and farther away than they are. Check every answer on site.';

export function QuickCautionLine() {
  const [open, setOpen] = useState(false);
  return (
    <View style={styles.box} testID="quick-caution-line" role="note" aria-label="Safety caution">
      <View style={styles.row}>
        <View style={styles.mark} />
        <AppText variant="small" style={styles.text}>
          {QUICK_SHORT_CAUTION}
        </AppText>
      </View>
      <Pressable
        testID="quick-caution-toggle"
        role="button"
        aria-expanded={open}
        onPress={() => setOpen(!open)}
        style={({ pressed }) => [styles.toggle, pressed && styles.pressed]}
      >
        <AppText variant="small" style={styles.toggleText}>
          {open ? 'Hide the four cautions' : 'Read all four cautions'}
        </AppText>
      </Pressable>
      {open ? <SafetyCautions compact testID="quick-caution-full" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: spacing.xs,
    paddingVertical: spacing.sm,
    paddingHorizontal: spacing.md,
    borderRadius: radii.md,
    borderLeftWidth: 4,
    borderLeftColor: palette.beaconPressed,
    backgroundColor: palette.beaconSoft,
  },
  row: { flexDirection: 'row', gap: spacing.sm, alignItems: 'flex-start' },
  // The same amber diamond as the full caution block.
  mark: {
    width: 9,
    height: 9,
    marginTop: 7,
    backgroundColor: palette.beacon,
    borderWidth: 1.5,
    borderColor: palette.asphalt,
    transform: [{ rotate: '45deg' }],
  },
  text: { flex: 1 },
  toggle: { alignSelf: 'flex-start', minHeight: 44, justifyContent: 'center' },
  pressed: { opacity: 0.7 },
  toggleText: { color: palette.glass, textDecorationLine: 'underline' },
});
