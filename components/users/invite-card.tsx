import { InviteForm } from '@/components/forms/invite-form';
import { AppText, Card } from '@/components/ui';
import { useInviteUserMutation } from '@/hooks/use-users';

export function InviteCard() {
  const invite = useInviteUserMutation();
  return (
    <Card title="Invite someone" testID="invite-card">
      <AppText tone="muted">They get an e-mail with a link to choose their own password. You never see or send a password.</AppText>
      <InviteForm
        onSubmit={(body) => invite.mutateAsync(body)}
        sentNote="In demo mode the e-mail and its delivery status are in the Outbox."
      />
    </Card>
  );
}
