import { StyleSheet, View } from 'react-native';
import { Button, CenteredMessage, EmptyState, Notice, TextLink } from '@/components/ui';
import { spacing } from '@/constants/theme';
import { useOutboxQuery } from '@/hooks/use-outbox';
import { describeError } from '@/shared/errors';
import { OutboxMessage } from './outbox-message';

export function OutboxPanel() {
  const outbox = useOutboxQuery();
  if (outbox.isPending) return <CenteredMessage loading title="Loading the outbox…" testID="outbox-loading" />;
  if (outbox.isError) {
    return (
      <CenteredMessage
        title="The outbox did not load"
        body={describeError(outbox.error)}
        testID="outbox-error"
        action={<Button label="Try again" variant="secondary" testID="outbox-retry" onPress={() => void outbox.refetch()} />}
      />
    );
  }
  const { messages, demo } = outbox.data;
  return (
    <View style={styles.column}>
      {demo ? (
        <Notice tone="info" testID="outbox-demo">
          Demo mode: e-mail Sightfan sends is caught here instead of being delivered. Newest first.
        </Notice>
      ) : (
        <Notice tone="info" testID="outbox-live">
          Sightfan is not in demo mode: e-mail goes to your mail server and is not kept here.
        </Notice>
      )}
      {messages.length === 0 ? (
        <EmptyState
          testID="outbox-empty"
          title="No e-mail yet"
          body="Invitations, password notices and specification sheets e-mailed to buyers appear here as they are sent."
          next={<TextLink href="/users" testID="outbox-go-users" label="Invite someone on the Users screen" />}
        />
      ) : (
        [...messages]
          .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt))
          .map((message) => <OutboxMessage key={message.id} message={message} />)
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
});
