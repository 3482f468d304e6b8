import { router } from 'expo-router';
import { CatalogList } from '@/components/catalog/catalog-list';
import { useDisplayUnits } from '@/components/placement/use-display-units';
import { Button, Screen } from '@/components/ui';
import { useSession } from '@/hooks/use-session';

export default function CatalogScreen() {
  const { user } = useSession();
  const units = useDisplayUnits();
  if (!user) return null;
  const isAdmin = user.role === 'admin';
  return (
    <Screen
      title="Catalogue"
      lead="Convex mirrors you can mount: size, radius of curvature, focal length and price. Demo items are invented and marked as such."
      width="full"
      footer={isAdmin ? <Button label="New mirror" testID="catalog-new" onPress={() => router.push('/catalog/new')} block /> : undefined}
    >
      <CatalogList units={units} isAdmin={isAdmin} />
    </Screen>
  );
}
