import type { ReactNode } from 'react';
import { StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import { palette, radii, shadow, spacing } from '@/constants/theme';
import { AppText } from './text';

export interface CardProps {
  title?: string;
  children: ReactNode;
  style?: StyleProp<ViewStyle>;
  testID?: string;
}

export function Card({ title, children, style, testID }: CardProps) {
  return (
    <View style={[styles.card, style]} testID={testID}>
      {title ? (
        <AppText variant="heading" role="heading" aria-level={2}>
          {title}
        </AppText>
      ) : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: palette.card,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: palette.ruleSoft,
    padding: spacing.lg,
    gap: spacing.md,
    ...shadow,
  },
});
