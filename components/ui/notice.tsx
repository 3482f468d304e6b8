import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { palette, radii, spacing } from '@/constants/theme';
import { AppText } from './text';

export type NoticeTone = 'stop' | 'go' | 'info';

export interface NoticeProps {
  tone: NoticeTone;
  children: ReactNode;
  testID?: string;
}

/** A sentence in a band: the form-level error above a submit button, a success line, a demo note. */
export function Notice({ tone, children, testID }: NoticeProps) {
  return (
    <View style={[styles.band, bandStyles[tone]]} testID={testID} role={tone === 'stop' ? 'alert' : 'status'} aria-live="polite">
      {typeof children === 'string' ? (
        <AppText variant="bodyStrong" tone={textTone[tone]}>
          {children}
        </AppText>
      ) : (
        children
      )}
    </View>
  );
}

const textTone = { stop: 'stop', go: 'go', info: 'ink' } as const;

const styles = StyleSheet.create({
  band: { borderLeftWidth: 6, borderRadius: radii.sm, paddingVertical: spacing.md, paddingHorizontal: spacing.lg, gap: spacing.xs },
});

const bandStyles = StyleSheet.create({
  stop: { backgroundColor: palette.stopSoft, borderLeftColor: palette.stop },
  go: { backgroundColor: palette.goSoft, borderLeftColor: palette.go },
  info: { backgroundColor: palette.glassSoft, borderLeftColor: palette.glass },
});
