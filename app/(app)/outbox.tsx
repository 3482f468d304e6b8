import { OutboxPanel } from '@/components/outbox/outbox-panel';
import { Screen } from '@/components/ui';

export default function OutboxScreen() {
  return (
    <Screen
      title="Outbox"
      lead="E-mail Sightfan has sent: invitations and password notices with their links, and specification sheets sent to buyers, whose PDF you can open here."
      scrollLabel="Outbox messages"
    >
      <OutboxPanel />
    </Screen>
  );
}
