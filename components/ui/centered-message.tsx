import type { ReactNode } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { palette, spacing } from '@/constants/theme';
import { AppText } from './text';

export interface CenteredMessageProps {
  title?: string;
  body?: string;
  /** Show a spinner instead of (or above) the text. */
  loading?: boolean;
  action?: ReactNode;
  testID?: string;
  /** `screen-title` when this message is the whole screen (e.g. not found). */
  titleTestID?: string;
}

/** Whole-area states: loading, "cannot reach the server", a broken screen. */
export function CenteredMessage({ title, body, loading, action, testID, titleTestID }: CenteredMessageProps) {
  return (
    <View style={styles.root} testID={testID}>
      {loading ? <ActivityIndicator size="large" color={palette.glass} accessibilityLabel={title ?? 'Loading'} /> : null}
      {title ? (
        <AppText variant="heading" role="heading" aria-level={1} style={styles.center} testID={titleTestID}>
          {title}
        </AppText>
      ) : null}
      {body ? (
        <AppText variant="body" tone="muted" style={styles.center}>
          {body}
        </AppText>
      ) : null}
      {action}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: spacing.md, padding: spacing.xl, backgroundColor: palette.chalk },
  center: { textAlign: 'center', maxWidth: 480 },
});
