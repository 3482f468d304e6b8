import { StyleSheet, Text, type TextProps } from 'react-native';
import { palette, type as typeScale } from '@/constants/theme';

export type TextVariant = keyof typeof typeScale;
export type TextTone = 'ink' | 'muted' | 'stop' | 'go' | 'glass' | 'onAsphalt' | 'onAsphaltMuted';

export interface AppTextProps extends TextProps {
  variant?: TextVariant;
  tone?: TextTone;
}

/** Text in the theme's type scale; every string on screen goes through here. */
export function AppText({ variant = 'body', tone = 'ink', style, ...rest }: AppTextProps) {
  return <Text {...rest} style={[typeScale[variant], toneStyles[tone], style]} />;
}

const toneStyles = StyleSheet.create({
  ink: { color: palette.asphalt },
  muted: { color: palette.haze },
  stop: { color: palette.stop },
  go: { color: palette.go },
  glass: { color: palette.glass },
  onAsphalt: { color: palette.onAsphalt },
  onAsphaltMuted: { color: palette.onAsphaltMuted },
});
