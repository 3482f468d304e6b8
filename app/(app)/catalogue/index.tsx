import { router } from 'expo-router';
import { CatalogueList } from '@/components/catalogue/catalogue-list';
import { useDisplayUnits } from '@/components/placement/use-display-units';
import { Button, Screen } from '@/components/ui';
import { useSession } from '@/hooks/use-session';

export default function CatalogueScreen() {
  const { user } = useSession();
  const units = useDisplayUnits();
  if (!user) return null;
  const isAdmin = user.role === 'admin';
  return (
    <Screen
      title="Catalogue"
      lead="Convex mirrors you can mount: size, radius of curvature, focal length and price. Demo items are invented and marked as such."
      width="full"
      footer={
        isAdmin ? <Button label="New mirror" testID="catalogue-new" onPress={() => router.push('/catalogue/new')} block /> : undefined
      }
    >
      <CatalogueList units={units} isAdmin={isAdmin} />
    </Screen>
  );
}
