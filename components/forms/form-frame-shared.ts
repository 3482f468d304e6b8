import type { ReactNode } from 'react';
import { StyleSheet } from 'react-native';
import { spacing } from '@/constants/theme';

/** Shared by form-frame.tsx and form-frame.web.tsx (the web file shadows the plain one there, so it cannot import it). */
export interface FormFrameProps {
  /** Accessible name of the form. */
  label: string;
  onSubmit: () => void;
  children: ReactNode;
  testID?: string;
}

export const formFrameStyles = StyleSheet.create({
  column: { gap: spacing.lg, alignSelf: 'stretch' },
});
