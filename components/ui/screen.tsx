import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { layout, palette, spacing } from '@/constants/theme';
import { useIsWide } from '@/hooks/use-breakpoint';
import { ScreenHeading } from './screen-heading';

export interface ScreenProps {
  title: string;
  /** One line under the title saying what this screen is for. */
  lead?: string;
  children: ReactNode;
  /**
   * Actions kept in reach of the thumb: pinned under the content on a phone, in line on a wide
   * screen where reach does not matter.
   */
  footer?: ReactNode;
  /** 'narrow' for forms and reading, 'full' for tables beside a form; default suits most screens. */
  width?: 'narrow' | 'default' | 'full';
  /**
   * Names the scrolling area and lets the keyboard reach it (Tab, then arrow keys), for screens whose
   * content may hold nothing focusable to scroll to (a list of e-mails).
   */
  scrollLabel?: string;
}

/** Every signed-in screen's frame: heading (test id `screen-title`), scrolling content, optional footer. */
export function Screen({ title, lead, children, footer, width = 'default', scrollLabel }: ScreenProps) {
  const wide = useIsWide();
  const columnStyle = [styles.column, width === 'narrow' && styles.narrow, width === 'full' && styles.full];
  return (
    <View style={styles.root}>
      <ScrollView
        contentContainerStyle={[styles.scroll, wide && styles.scrollWide]}
        keyboardShouldPersistTaps="handled"
        {...(scrollLabel ? { focusable: true, role: 'region' as const, 'aria-label': scrollLabel, testID: 'screen-scroll' } : {})}
      >
        <View style={columnStyle}>
          <ScreenHeading title={title} lead={lead} />
          {children}
          {footer && wide ? <View style={styles.footerInline}>{footer}</View> : null}
        </View>
      </ScrollView>
      {footer && !wide ? <View style={styles.footerPinned}>{footer}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: palette.chalk },
  scroll: { padding: spacing.lg, paddingBottom: spacing.xxl },
  scrollWide: { paddingHorizontal: spacing.xxl, paddingTop: spacing.xxl },
  column: { width: '100%', maxWidth: layout.contentMaxWidth, alignSelf: 'center', gap: spacing.xl },
  narrow: { maxWidth: 640 },
  full: { maxWidth: 1280 },
  footerInline: { flexDirection: 'row', gap: spacing.md },
  footerPinned: {
    padding: spacing.lg,
    gap: spacing.sm,
    backgroundColor: palette.chalk,
    borderTopWidth: 1,
    borderTopColor: palette.ruleSoft,
  },
});
