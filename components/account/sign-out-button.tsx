import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText, Button, Notice } from '@/components/ui';
import { palette, spacing } from '@/constants/theme';
import { useWaitingWrites } from '@/hooks/use-connection';
import { useSignOutMutation } from '@/hooks/use-session';
import { describeError } from '@/shared/errors';

/** The question asked before signing out while `n` of the person's changes have not reached the server. */
export function waitingQuestion(n: number): string {
  return n === 1
    ? '1 change you made has not reached the server yet. Keep it on this device for the next time you sign in here, or discard it?'
    : `${n} changes you made have not reached the server yet. Keep them on this device for the next time you sign in here, or discard them?`;
}

/**
 * Signing out clears the session query and what this device keeps (hooks/offline.ts); the root
 * guard then shows the sign-in screen. With changes still waiting it asks first: keep them for next
 * time (set aside for this person only, hooks/device-accounts.ts), discard them, or stay signed in.
 */
export function SignOutButton() {
  const signOut = useSignOutMutation();
  const { waiting } = useWaitingWrites();
  const [asking, setAsking] = useState(false);
  const error = signOut.isError ? (
    <Notice tone="stop" testID="sign-out-error">
      {describeError(signOut.error)}
    </Notice>
  ) : null;
  if (asking && waiting > 0) {
    const one = waiting === 1;
    return (
      <View style={[styles.column, styles.confirm]} testID="sign-out-confirmation">
        <AppText variant="bodyStrong" testID="sign-out-question">
          {waitingQuestion(waiting)}
        </AppText>
        <View style={styles.actions}>
          <Button
            label={one ? 'Keep it for next time' : 'Keep them for next time'}
            testID="sign-out-keep"
            busy={signOut.isPending && signOut.variables === 'keep'}
            onPress={() => signOut.mutate('keep')}
          />
          <Button
            label={one ? 'Discard it' : 'Discard them'}
            testID="sign-out-discard"
            variant="danger"
            busy={signOut.isPending && signOut.variables === 'discard'}
            onPress={() => signOut.mutate('discard')}
          />
          <Button label="Stay signed in" testID="sign-out-stay" variant="secondary" onPress={() => setAsking(false)} />
        </View>
        {error}
      </View>
    );
  }
  return (
    <View style={styles.column}>
      {error}
      <Button
        label="Sign out"
        variant="secondary"
        testID="account-sign-out"
        busy={signOut.isPending}
        // Nothing waits: "keep" sets aside only a refused change still waiting for this person's choice.
        onPress={() => (waiting > 0 ? setAsking(true) : signOut.mutate('keep'))}
        block
      />
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, alignItems: 'center' },
  confirm: {
    padding: spacing.md,
    borderWidth: 2,
    borderColor: palette.beacon,
    borderRadius: 8,
    alignSelf: 'stretch',
  },
});
