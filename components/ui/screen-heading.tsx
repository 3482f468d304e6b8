import { StyleSheet, View } from 'react-native';
import { spacing } from '@/constants/theme';
import { useIsWide } from '@/hooks/use-breakpoint';
import { PageTitle } from './page-title';
import { AppText } from './text';

/** A screen's title (test id `screen-title`, also the browser tab's title) and its one-line lead. */
export function ScreenHeading({ title, lead }: { title: string; lead?: string }) {
  const wide = useIsWide();
  return (
    <View style={styles.heading}>
      <PageTitle title={title} />
      <AppText variant={wide ? 'display' : 'title'} role="heading" aria-level={1} testID="screen-title">
        {title}
      </AppText>
      {lead ? (
        <AppText variant="body" tone="muted">
          {lead}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({ heading: { gap: spacing.sm } });
