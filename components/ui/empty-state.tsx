import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { palette, radii, spacing } from '@/constants/theme';
import { AppText } from './text';

export interface EmptyStateProps {
  /** What this place is for, in a few words. */
  title: string;
  /** What will appear here, and when. */
  body: string;
  /** What the person can usefully do right now. */
  next?: ReactNode;
  art?: ReactNode;
  testID?: string;
}

export function EmptyState({ title, body, next, art, testID }: EmptyStateProps) {
  return (
    <View style={styles.box} testID={testID}>
      {art}
      <AppText variant="heading" role="heading" aria-level={2} style={styles.center}>
        {title}
      </AppText>
      <AppText variant="body" tone="muted" style={styles.center}>
        {body}
      </AppText>
      {next ? <View style={styles.next}>{next}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    alignItems: 'center',
    gap: spacing.md,
    paddingVertical: spacing.xxl,
    paddingHorizontal: spacing.xl,
    borderWidth: 2,
    borderStyle: 'dashed',
    borderColor: palette.rule,
    borderRadius: radii.lg,
  },
  center: { textAlign: 'center', maxWidth: 520 },
  next: { marginTop: spacing.sm, alignItems: 'center', gap: spacing.sm, alignSelf: 'stretch' },
});
