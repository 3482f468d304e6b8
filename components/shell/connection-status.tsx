/**
 * The quiet line that says the app is offline and how many changes wait (and, on a shared device,
 * that another account's changes wait here for that person: hooks/device-accounts.ts). It is always in the
 * page (an empty polite status region when there is nothing to say) so a screen reader hears
 * the change when the connection goes or comes back.
 */
import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui';
import { palette, spacing } from '@/constants/theme';
import { useIsOnline, useWaitingWrites, useWritesOfOtherAccounts } from '@/hooks/use-connection';

const changes = (n: number) => (n === 1 ? '1 change waits' : `${n} changes wait`);

/** The sentence for this state; empty when online with nothing waiting. */
export function connectionText(online: boolean, waiting: number): string {
  if (!online) return waiting > 0 ? `Offline · ${changes(waiting)} to be sent` : 'Offline · showing what this device keeps';
  return waiting > 0 ? `Back online · sending ${waiting === 1 ? '1 change' : `${waiting} changes`}…` : '';
}

/** Said while changes made on this device by another account wait for that person to sign in here. */
export const OTHER_ACCOUNT_WAITING = 'Changes made by another account on this device are waiting for it.';

/** `rail`: a framed line in the wide layout's side rail; `band`: a strip under the phone's top bar. */
export function ConnectionStatus({ shape }: { shape: 'rail' | 'band' }) {
  const online = useIsOnline();
  const { waiting } = useWaitingWrites();
  const others = useWritesOfOtherAccounts();
  const text = connectionText(online, waiting);
  return (
    <View role="status" aria-live="polite" testID="connection-status" style={text || others ? styles[shape] : styles.empty}>
      {text ? (
        <AppText variant="small" tone="onAsphalt" testID="connection-status-text">
          {text}
        </AppText>
      ) : null}
      {others > 0 ? (
        <AppText variant="small" tone="onAsphalt" testID="connection-status-others">
          {OTHER_ACCOUNT_WAITING}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  rail: {
    paddingHorizontal: spacing.sm,
    paddingVertical: spacing.xs,
    borderRadius: 4,
    borderWidth: 1,
    borderColor: palette.beacon,
  },
  band: {
    paddingHorizontal: spacing.lg,
    paddingVertical: spacing.xs,
    backgroundColor: palette.asphaltRaised,
    borderBottomWidth: 1,
    borderBottomColor: palette.beacon,
  },
  empty: { width: 0, height: 0, overflow: 'hidden' },
});
