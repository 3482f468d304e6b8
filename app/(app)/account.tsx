import { PersonCard } from '@/components/account/person-card';
import { SignOutButton } from '@/components/account/sign-out-button';
import { UnitsControl } from '@/components/account/units-control';
import { ChangePasswordForm } from '@/components/forms/change-password-form';
import { Card, Screen } from '@/components/ui';
import { useChangePasswordMutation, useSession } from '@/hooks/use-session';

export default function AccountScreen() {
  const { user } = useSession();
  const changePassword = useChangePasswordMutation();
  if (!user) return null;
  return (
    <Screen title="Account" lead="Who you are in Sightfan and how numbers are shown to you." width="narrow" footer={<SignOutButton />}>
      <PersonCard user={user} />
      <Card title="Units">
        <UnitsControl units={user.units} />
      </Card>
      <Card title="Password">
        <ChangePasswordForm onSubmit={(values) => changePassword.mutateAsync(values)} />
      </Card>
    </Screen>
  );
}
