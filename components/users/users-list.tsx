import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui';
import { palette, radii, shadow, spacing } from '@/constants/theme';
import { useUpdateUserMutation } from '@/hooks/use-users';
import type { UserDto } from '@/shared/schemas';
import type { UsersViewProps } from './users-table';
import { UserActionError, UserDisableButton, UserReinviteButton, UserRoleControl } from './user-actions';
import { UserStatus } from './user-status';

/** Phones: one block per person, controls stacked at full width for the thumb. */
export function UsersList({ users, currentUserId }: UsersViewProps) {
  return (
    <View style={styles.list} role="list" aria-label="People in your organisation" testID="users-list">
      {users.map((user) => (
        <ListItem key={user.id} user={user} isSelf={user.id === currentUserId} />
      ))}
    </View>
  );
}

function ListItem({ user, isSelf }: { user: UserDto; isSelf: boolean }) {
  const mutation = useUpdateUserMutation();
  return (
    <View style={styles.item} role="listitem" testID={`user-row-${user.id}`}>
      <View style={styles.head}>
        <View style={styles.who}>
          <AppText variant="bodyStrong">{user.name}</AppText>
          <AppText variant="small" tone="muted" selectable>
            {user.email}
          </AppText>
        </View>
        <UserStatus user={user} />
      </View>
      <UserRoleControl user={user} isSelf={isSelf} mutation={mutation} stretch />
      <UserDisableButton user={user} isSelf={isSelf} mutation={mutation} />
      <UserReinviteButton user={user} />
      <UserActionError user={user} mutation={mutation} />
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.md },
  item: {
    backgroundColor: palette.card,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: palette.ruleSoft,
    padding: spacing.lg,
    gap: spacing.md,
    ...shadow,
  },
  head: { flexDirection: 'row', gap: spacing.md, alignItems: 'flex-start' },
  who: { flex: 1, gap: 2 },
});
