import { StyleSheet, View } from 'react-native';
import Svg, { Line, Path } from 'react-native-svg';
import { palette, spacing } from '@/constants/theme';
import { AppText } from './text';

/**
 * Sightfan's mark: a convex mirror seen edge-on, throwing its widened fan of view. The fan is
 * the product's whole idea (a convex face trades image size for a wider field), so it is the logo.
 */
export function BrandMark({ size = 32, onDark = false }: { size?: number; onDark?: boolean }) {
  const mirror = onDark ? palette.onAsphalt : palette.asphalt;
  return (
    <Svg width={size} height={size} viewBox="0 0 32 32" aria-hidden>
      <Path d="M9 16 L30 4 A26 26 0 0 1 30 28 Z" fill={palette.beacon} />
      <Line x1={9} y1={16} x2={30} y2={10} stroke={palette.asphalt} strokeOpacity={0.35} strokeWidth={1.2} />
      <Line x1={9} y1={16} x2={31} y2={16} stroke={palette.asphalt} strokeOpacity={0.35} strokeWidth={1.2} />
      <Line x1={9} y1={16} x2={30} y2={22} stroke={palette.asphalt} strokeOpacity={0.35} strokeWidth={1.2} />
      <Path d="M3 4 Q13 16 3 28" stroke={mirror} strokeWidth={3.5} strokeLinecap="round" fill="none" />
    </Svg>
  );
}

/** The mark with the name beside it, for the rail, the phone header and the sign-in screen. */
export function Wordmark({ onDark = false, size = 'md' }: { onDark?: boolean; size?: 'md' | 'lg' }) {
  const large = size === 'lg';
  return (
    <View style={styles.row} role="img" aria-label="Sightfan">
      <BrandMark size={large ? 44 : 30} onDark={onDark} />
      <AppText variant={large ? 'display' : 'heading'} tone={onDark ? 'onAsphalt' : 'ink'} style={styles.word}>
        Sightfan
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  word: { letterSpacing: 0.5 },
});
