import { StyleSheet, View } from 'react-native';
import { Button, Notice } from '@/components/ui';
import { spacing } from '@/constants/theme';
import { useSignOutMutation } from '@/hooks/use-session';
import { describeError } from '@/shared/errors';

/** Signing out clears the session query; the root guard then shows the sign-in screen. */
export function SignOutButton() {
  const signOut = useSignOutMutation();
  return (
    <View style={styles.column}>
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
