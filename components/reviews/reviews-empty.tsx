import { StyleSheet, View } from 'react-native';
import Svg, { Path } from 'react-native-svg';
import { AppText, Card, EmptyState, TextLink } from '@/components/ui';
import { palette, spacing } from '@/constants/theme';

/** Nothing can be sent for review yet; this says what will arrive here and how, without fake entries. */
export function ReviewsEmpty() {
  return (
    <View style={styles.column}>
      <EmptyState
        testID="reviews-empty"
        art={<ShieldArt />}
        title="Nothing is waiting for you"
        body="When an installer sends a job for review, it appears here with the coverage of every mirror mount. You will approve it or send it back with comments, and your approval goes on the specification sheet."
      />
      <Card title="While you wait">
        <AppText>
          There is nothing to set up for reviews. You can choose metric or imperial units now, so distances and heights read the way you
          check them.
        </AppText>
        <TextLink href="/account" testID="reviews-go-account" label="Open your account" />
      </Card>
    </View>
  );
}

function ShieldArt() {
  return (
    <Svg width={72} height={72} viewBox="0 0 24 24" aria-hidden>
      <Path
        d="M12 2.5 L20.5 5.7 V12 C20.5 16.8 16.8 20.3 12 21.5 C7.2 20.3 3.5 16.8 3.5 12 V5.7 Z"
        fill={palette.glassSoft}
        stroke={palette.glass}
        strokeWidth={1.5}
      />
      <Path
        d="M8.5 12 L11 14.5 L15.5 9.5"
        stroke={palette.glass}
        strokeWidth={1.8}
        fill="none"
        strokeLinecap="round"
        strokeLinejoin="round"
      />
    </Svg>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.xl },
});
