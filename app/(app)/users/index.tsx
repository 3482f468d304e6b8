import { StyleSheet, View } from 'react-native';
import { InviteCard } from '@/components/users/invite-card';
import { UsersPanel } from '@/components/users/users-panel';
import { Screen } from '@/components/ui';
import { layout } from '@/constants/theme';
import { useSession } from '@/hooks/use-session';

/** The people first, the invite form after them: low on a phone (thumb reach), below the table when wide. */
export default function UsersScreen() {
  const { user } = useSession();
  if (!user) return null;
  return (
    <Screen title="Users" lead={`People of ${user.organizationName}: their role, and whether they may sign in.`} width="full">
      <UsersPanel currentUserId={user.id} />
      <View style={styles.invite}>
        <InviteCard />
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  invite: { width: '100%', maxWidth: layout.formMaxWidth + 80 },
});
