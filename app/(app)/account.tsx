import { PersonCard } from '@/components/account/person-card';
import { SignOutButton } from '@/components/account/sign-out-button';
import { UnitsControl } from '@/components/account/units-control';
import { Card, Screen } from '@/components/ui';
import { useSession } from '@/hooks/use-session';

export default function AccountScreen() {
  const { user } = useSession();
  if (!user) return null;
  return (
    <Screen title="Account" lead="Who you are in Sightfan and how numbers are shown to you." width="narrow" footer={<SignOutButton />}>
      <PersonCard user={user} />
      <Card title="Units">
        <UnitsControl units={user.units} />
      </Card>
    </Screen>
  );
}
