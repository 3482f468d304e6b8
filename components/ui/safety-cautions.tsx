import { StyleSheet, View } from 'react-native';
import { palette, radii, spacing } from '@/constants/theme';
import { AppText } from './text';

/**
 * The cautions every screen that shows coverage carries (PRODUCT.md, "Cautions the product always
 * carries"). Kept as data so the PDF sheet and tests can use the same words.
 */
export const SAFETY_CAUTIONS = [
  {
    key: 'smaller-farther',
    text: 'Objects in a convex mirror appear smaller and farther away than they are; judge speed and gaps with care.',
  },
  {
    key: 'supplements',
    text: 'A mirror supplements direct sight, procedures and other safety measures; it replaces none of them.',
  },
  {
    key: 'codes',
    text: 'Mounting height, clearances and required fields of view are set by local vehicle, road, building and workplace-safety codes, which take precedence; check with the authority or a licensed professional.',
  },
  {
    key: 'verify',
    text: 'Computed coverage assumes the dimensions entered; verify on site with a person walking the zone.',
  },
] as const;

export interface SafetyCautionsProps {
  /** A tighter block for beside a drawing: smaller type, same four sentences (never fewer). */
  compact?: boolean;
  testID?: string;
}

export function SafetyCautions({ compact, testID = 'safety-cautions' }: SafetyCautionsProps) {
  return (
    <View style={[styles.box, compact && styles.compact]} testID={testID} role="note" aria-label="Safety cautions">
      <AppText variant="caps">Before you rely on these numbers</AppText>
      {SAFETY_CAUTIONS.map((c) => (
        <View key={c.key} style={styles.row} testID={`safety-caution-${c.key}`}>
          <View style={styles.mark} />
          <AppText variant={compact ? 'small' : 'body'} style={styles.text}>
            {c.text}
          </AppText>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: spacing.sm,
    padding: spacing.lg,
    borderRadius: radii.md,
    borderWidth: 2,
    borderColor: palette.beaconPressed,
    backgroundColor: palette.beaconSoft,
  },
  compact: { padding: spacing.md, gap: spacing.xs },
  row: { flexDirection: 'row', gap: spacing.sm, alignItems: 'flex-start' },
  // A small amber-on-asphalt diamond: reads as "caution" without borrowing any standard sign.
  mark: { width: 9, height: 9, marginTop: 8, backgroundColor: palette.beacon, borderWidth: 1.5, borderColor: palette.asphalt, transform: [{ rotate: '45deg' }] },
  text: { flex: 1 },
});
