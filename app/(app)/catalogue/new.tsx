import { Redirect, router } from 'expo-router';
import { bodyOf, CatalogueForm } from '@/components/catalogue/catalogue-form';
import { useDisplayUnits } from '@/components/placement/use-display-units';
import { Screen } from '@/components/ui';
import { useCreateCatalogueItemMutation } from '@/hooks/use-catalogue';
import { useSession } from '@/hooks/use-session';

export default function NewCatalogueItemScreen() {
  const { user } = useSession();
  const units = useDisplayUnits();
  const create = useCreateCatalogueItemMutation();
  if (!user) return null;
  if (user.role !== 'admin') return <Redirect href="/catalogue" />;
  return (
    <Screen title="New mirror" lead="Sizes accept either system: type “600 mm” or “24 in”." width="narrow">
      <CatalogueForm
        item={null}
        units={units}
        submitLabel="Add to catalogue"
        onSubmit={async (values) => {
          await create.mutateAsync(bodyOf(values));
          router.replace('/catalogue');
        }}
      />
    </Screen>
  );
}
