import { Redirect, router } from 'expo-router';
import { bodyOf, CatalogForm } from '@/components/catalog/catalog-form';
import { useDisplayUnits } from '@/components/placement/use-display-units';
import { Screen } from '@/components/ui';
import { useCreateCatalogItemMutation } from '@/hooks/use-catalog';
import { useSession } from '@/hooks/use-session';

export default function NewCatalogItemScreen() {
  const { user } = useSession();
  const units = useDisplayUnits();
  const create = useCreateCatalogItemMutation();
  if (!user) return null;
  if (user.role !== 'admin') return <Redirect href="/catalog" />;
  return (
    <Screen title="New mirror" lead="Sizes accept either system: type “600 mm” or “24 in”." width="narrow">
      <CatalogForm
        item={null}
        units={units}
        submitLabel="Add to catalogue"
        onSubmit={async (values) => {
          await create.mutateAsync(bodyOf(values));
          router.replace('/catalog');
        }}
      />
    </Screen>
  );
}
