import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { AppText, Wordmark } from '@/components/ui';
import { ScreenHeading } from '@/components/ui/screen-heading';
import { layout, palette, spacing } from '@/constants/theme';
import { useIsWide } from '@/hooks/use-breakpoint';
import { SAFETY_CAUTIONS } from '@/shared/cautions';
import { FanIllustration } from './fan-illustration';

export interface AuthFrameProps {
  title: string;
  lead?: string;
  children: ReactNode;
}

const TAGLINE = 'Size convex safety mirrors, show the zone each one covers, and get the sheet approved.';

/** The signed-out screens' frame: the brand panel beside the form when wide, above it on a phone. */
export function AuthFrame({ title, lead, children }: AuthFrameProps) {
  const wide = useIsWide();
  const insets = useSafeAreaInsets();
  const heading = <ScreenHeading title={title} lead={lead} />;

  if (wide) {
    return (
      <View style={styles.wideRoot}>
        <View style={styles.brandPanel}>
          <Wordmark onDark size="lg" />
          <View style={styles.figure}>
            <FanIllustration width={500} />
            {/* The drawing shows a mirror's coverage, so it carries the first caution, whole. */}
            <AppText variant="small" tone="onAsphalt" testID="illustration-caution" style={styles.caution}>
              {SAFETY_CAUTIONS[0].text}
            </AppText>
          </View>
          <AppText variant="heading" tone="onAsphalt" style={styles.tagline}>
            {TAGLINE}
          </AppText>
        </View>
        <ScrollView style={styles.formSide} contentContainerStyle={styles.formSideContent} keyboardShouldPersistTaps="handled">
          <View style={styles.formColumn}>
            {heading}
            {children}
          </View>
        </ScrollView>
      </View>
    );
  }

  return (
    <ScrollView
      style={styles.narrowRoot}
      contentContainerStyle={{ paddingBottom: insets.bottom + spacing.xl }}
      keyboardShouldPersistTaps="handled"
    >
      <View style={[styles.phoneBand, { paddingTop: insets.top + spacing.lg }]}>
        <Wordmark onDark />
        <AppText variant="body" tone="onAsphaltMuted">
          {TAGLINE}
        </AppText>
      </View>
      <View style={styles.phoneForm}>
        {heading}
        {children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: palette.chalk },
  brandPanel: {
    flex: 1,
    maxWidth: 620,
    backgroundColor: palette.asphalt,
    padding: spacing.xxxl,
    justifyContent: 'space-between',
    alignItems: 'flex-start',
  },
  tagline: { maxWidth: 440 },
  figure: { gap: spacing.sm },
  caution: { maxWidth: 500 },
  formSide: { flex: 1 },
  formSideContent: { flexGrow: 1, justifyContent: 'center', padding: spacing.xxxl },
  formColumn: { width: '100%', maxWidth: layout.formMaxWidth, alignSelf: 'center', gap: spacing.xl },
  narrowRoot: { flex: 1, backgroundColor: palette.chalk },
  phoneBand: { backgroundColor: palette.asphalt, paddingHorizontal: spacing.lg, paddingBottom: spacing.xl, gap: spacing.md },
  phoneForm: { padding: spacing.lg, gap: spacing.xl },
});
