import { StyleSheet, View } from 'react-native';
import { palette, radii, spacing } from '@/constants/theme';
import { AppText } from './text';

export type BadgeTone = 'neutral' | 'go' | 'stop' | 'beacon' | 'glass';

export function Badge({ label, tone = 'neutral', testID }: { label: string; tone?: BadgeTone; testID?: string }) {
  return (
    <View style={[styles.badge, toneStyles[tone]]} testID={testID}>
      <AppText variant="caps" style={textStyles[tone]}>
        {label}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: { alignSelf: 'flex-start', paddingHorizontal: spacing.sm, paddingVertical: spacing.xxs, borderRadius: radii.sm, borderWidth: 1 },
});

const toneStyles = StyleSheet.create({
  neutral: { backgroundColor: palette.chalk, borderColor: palette.rule },
  go: { backgroundColor: palette.goSoft, borderColor: palette.go },
  stop: { backgroundColor: palette.stopSoft, borderColor: palette.stop },
  beacon: { backgroundColor: palette.beaconSoft, borderColor: palette.beaconPressed },
  glass: { backgroundColor: palette.glassSoft, borderColor: palette.glass },
});

const textStyles = StyleSheet.create({
  neutral: { color: palette.asphalt },
  go: { color: palette.go },
  stop: { color: palette.stop },
  beacon: { color: palette.asphalt },
  glass: { color: palette.glass },
});
