import { StyleSheet, View } from 'react-native';
import { AppText, Badge, Card } from '@/components/ui';
import { roleLabels } from '@/constants/navigation';
import { spacing } from '@/constants/theme';
import type { UserDto } from '@/shared/schemas';

export function PersonCard({ user }: { user: UserDto }) {
  return (
    <Card title="Signed in as" testID="account-person">
      <View style={styles.rows}>
        <AppText variant="heading">{user.name}</AppText>
        <AppText tone="muted" selectable>
          {user.email}
        </AppText>
        <Badge label={roleLabels[user.role]} tone="glass" />
      </View>
      <View style={styles.org}>
        <AppText variant="caps" tone="muted">
          Organisation
        </AppText>
        <AppText variant="bodyStrong">{user.organizationName}</AppText>
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  rows: { gap: spacing.xs },
  org: { gap: spacing.xxs },
});
