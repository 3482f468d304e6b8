import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui';
import { palette, radii, shadow, spacing } from '@/constants/theme';
import { useUpdateUserMutation } from '@/hooks/use-users';
import type { UserDto } from '@/shared/schemas';
import { UserActionError, UserDisableButton, UserReinviteButton, UserRoleControl } from './user-actions';
import { UserStatus } from './user-status';

export interface UsersViewProps {
  users: readonly UserDto[];
  currentUserId: number;
}

/** Wide screens: one row per person, columns that line up, controls in the row. */
export function UsersTable({ users, currentUserId }: UsersViewProps) {
  return (
    <View style={styles.table} role="table" aria-label="People in your organisation" testID="users-table">
      <View style={[styles.row, styles.headRow]} role="row">
        <HeadCell label="Person" style={styles.personCol} />
        <HeadCell label="Role" style={styles.roleCol} />
        <HeadCell label="Status" style={styles.statusCol} />
        <HeadCell label="Access" style={styles.actionCol} />
      </View>
      {users.map((user) => (
        <TableRow key={user.id} user={user} isSelf={user.id === currentUserId} />
      ))}
    </View>
  );
}

function HeadCell({ label, style }: { label: string; style: object }) {
  return (
    <View role="columnheader" style={style}>
      <AppText variant="caps" tone="muted">
        {label}
      </AppText>
    </View>
  );
}

function TableRow({ user, isSelf }: { user: UserDto; isSelf: boolean }) {
  const mutation = useUpdateUserMutation();
  return (
    <View style={[styles.row, styles.bodyRow, user.disabled && styles.disabledRow]} role="row" testID={`user-row-${user.id}`}>
      <View role="cell" style={styles.personCol}>
        <AppText variant="bodyStrong" numberOfLines={1}>
          {user.name}
        </AppText>
        <AppText variant="small" tone="muted" numberOfLines={1} selectable>
          {user.email}
        </AppText>
        <UserActionError user={user} mutation={mutation} />
      </View>
      <View role="cell" style={styles.roleCol}>
        <UserRoleControl user={user} isSelf={isSelf} mutation={mutation} />
      </View>
      <View role="cell" style={styles.statusCol}>
        <UserStatus user={user} />
      </View>
      <View role="cell" style={styles.actionCol}>
        <UserDisableButton user={user} isSelf={isSelf} mutation={mutation} />
        <UserReinviteButton user={user} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  table: {
    backgroundColor: palette.card,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: palette.ruleSoft,
    overflow: 'hidden',
    ...shadow,
  },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.lg, paddingHorizontal: spacing.lg },
  headRow: { paddingVertical: spacing.md, backgroundColor: palette.chalk, borderBottomWidth: 2, borderBottomColor: palette.rule },
  bodyRow: { paddingVertical: spacing.md, borderBottomWidth: 1, borderBottomColor: palette.ruleSoft },
  disabledRow: { backgroundColor: '#faf8f4' },
  personCol: { flex: 1, minWidth: 180 },
  roleCol: { width: 300 },
  statusCol: { width: 96 },
  actionCol: { width: 136, alignItems: 'flex-start', gap: spacing.xs },
});
