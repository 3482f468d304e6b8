import { Button, CenteredMessage, EmptyState } from '@/components/ui';
import { useIsWide } from '@/hooks/use-breakpoint';
import { useUsersQuery } from '@/hooks/use-users';
import { describeError } from '@/shared/errors';
import { UsersList } from './users-list';
import { UsersTable } from './users-table';

/** The people list in its loading, failed and loaded states; a table when wide, a list on a phone. */
export function UsersPanel({ currentUserId }: { currentUserId: number }) {
  const wide = useIsWide();
  const users = useUsersQuery();
  if (users.isPending) return <CenteredMessage loading title="Loading people…" testID="users-loading" />;
  if (users.isError) {
    return (
      <CenteredMessage
        title="The list of people did not load"
        body={describeError(users.error)}
        testID="users-error"
        action={<Button label="Try again" variant="secondary" testID="users-retry" onPress={() => void users.refetch()} />}
      />
    );
  }
  if (users.data.length === 0) {
    return (
      <EmptyState
        title="No one here yet"
        body="Invite the installers and safety reviewers of your organisation with the form."
        testID="users-empty"
      />
    );
  }
  return wide ? (
    <UsersTable users={users.data} currentUserId={currentUserId} />
  ) : (
    <UsersList users={users.data} currentUserId={currentUserId} />
  );
}
