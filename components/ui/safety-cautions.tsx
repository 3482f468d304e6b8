import { StyleSheet, View } from 'react-native';
import { palette, radii, spacing } from '@/constants/theme';
import { AppText } from './text';
import { SAFETY_CAUTIONS } from '@/shared/cautions';

export { SAFETY_CAUTIONS } from '@/shared/cautions';

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
  mark: {
    width: 9,
    height: 9,
    marginTop: 8,
    backgroundColor: palette.beacon,
    borderWidth: 1.5,
    borderColor: palette.asphalt,
    transform: [{ rotate: '45deg' }],
  },
  text: { flex: 1 },
});
