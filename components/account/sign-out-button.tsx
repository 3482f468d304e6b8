import { StyleSheet, View } from 'react-native';
import { Button, Notice } from '@/components/ui';
import { spacing } from '@/constants/theme';
import { useWaitingWrites } from '@/hooks/use-connection';
import { useSignOutMutation } from '@/hooks/use-session';
import { describeError } from '@/shared/errors';

/**
 * Signing out clears the session query and what this device keeps (hooks/offline.ts); the root
 * guard then shows the sign-in screen. Changes still waiting for a connection would go too: say so.
 */
export function SignOutButton() {
  const signOut = useSignOutMutation();
  const { waiting } = useWaitingWrites();
  return (
    <View style={styles.column}>
      {waiting > 0 ? (
        <Notice tone="info" testID="sign-out-waiting">
          {`${waiting === 1 ? '1 change has' : `${waiting} changes have`} not reached the server yet. Signing out now drops ${waiting === 1 ? 'it' : 'them'}; wait for a connection first.`}
        </Notice>
      ) : null}
      {signOut.isError ? (
        <Notice tone="stop" testID="sign-out-error">
          {describeError(signOut.error)}
        </Notice>
      ) : null}
      <Button
        label="Sign out"
        variant="secondary"
        testID="account-sign-out"
        busy={signOut.isPending}
        onPress={() => signOut.mutate()}
        block
      />
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.sm },
});
