import { StyleSheet, View } from 'react-native';
import { AppText, Button, Segmented } from '@/components/ui';
import { roleOptions, shortRoleLabels } from '@/constants/navigation';
import { spacing } from '@/constants/theme';
import { useReinviteUserMutation, useUpdateUserMutation } from '@/hooks/use-users';
import { describeError } from '@/shared/errors';
import type { Role, UserDto } from '@/shared/schemas';

export interface UserActionsProps {
  user: UserDto;
  /** The signed-in admin: they may not demote or disable themselves and lock the organisation out. */
  isSelf: boolean;
}

export function UserRoleControl({
  user,
  isSelf,
  mutation,
  stretch,
}: UserActionsProps & { mutation: ReturnType<typeof useUpdateUserMutation>; stretch?: boolean }) {
  const pendingRole = mutation.isPending ? mutation.variables?.body.role : undefined;
  return (
    <Segmented<Role>
      label={`Role of ${user.name}`}
      compact
      stretch={stretch}
      options={roleOptions.map((role) => ({ value: role, label: shortRoleLabels[role], testID: `user-role-${user.id}-${role}` }))}
      value={pendingRole ?? user.role}
      disabled={isSelf || mutation.isPending}
      onChange={(role) => mutation.mutate({ id: user.id, body: { role } })}
    />
  );
}

export function UserDisableButton({ user, isSelf, mutation }: UserActionsProps & { mutation: ReturnType<typeof useUpdateUserMutation> }) {
  if (isSelf) {
    return (
      <AppText variant="small" tone="muted">
        This is you
      </AppText>
    );
  }
  const label = user.disabled ? 'Enable' : 'Disable';
  return (
    <Button
      label={label}
      variant={user.disabled ? 'secondary' : 'danger'}
      testID={`user-disable-${user.id}`}
      accessibilityLabel={`${label} ${user.name}`}
      busy={mutation.isPending && mutation.variables?.body.disabled !== undefined}
      disabled={mutation.isPending}
      onPress={() => mutation.mutate({ id: user.id, body: { disabled: !user.disabled } })}
    />
  );
}

/** For someone invited who has not chosen a password yet: a fresh link, the old one retired. */
export function UserReinviteButton({ user }: { user: UserDto }) {
  const mutation = useReinviteUserMutation();
  if (user.hasPassword || user.disabled) return null;
  return (
    <View>
      <Button
        label="Invite again"
        variant="secondary"
        testID={`user-reinvite-${user.id}`}
        accessibilityLabel={`Send ${user.name} a new invitation`}
        busy={mutation.isPending}
        disabled={mutation.isPending}
        onPress={() => mutation.mutate(user.id)}
      />
      {mutation.isSuccess ? (
        <AppText variant="small" tone="muted" testID={`user-reinvite-done-${user.id}`} aria-live="polite">
          New link queued; the old one no longer works.
        </AppText>
      ) : null}
      {mutation.isError ? (
        <AppText variant="small" tone="stop" aria-live="polite">
          {describeError(mutation.error)}
        </AppText>
      ) : null}
    </View>
  );
}

export function UserActionError({ user, mutation }: { user: UserDto; mutation: ReturnType<typeof useUpdateUserMutation> }) {
  if (!mutation.isError) return null;
  return (
    <View style={styles.error}>
      <AppText variant="small" tone="stop" testID={`user-error-${user.id}`} aria-live="polite">
        {describeError(mutation.error)}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  error: { paddingTop: spacing.xs },
});
