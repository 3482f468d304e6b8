import { OutboxPanel } from '@/components/outbox/outbox-panel';
import { Screen } from '@/components/ui';

export default function OutboxScreen() {
  return (
    <Screen title="Outbox" lead="E-mail Sightfan has sent: invitations with their set-password links.">
      <OutboxPanel />
    </Screen>
  );
}
