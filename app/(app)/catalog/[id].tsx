import { router, useLocalSearchParams } from 'expo-router';
import { ActivityIndicator } from 'react-native';
import { bodyOf, CatalogForm } from '@/components/catalog/catalog-form';
import { CatalogDetails } from '@/components/catalog/catalog-details';
import { useDisplayUnits } from '@/components/placement/use-display-units';
import { Notice, Screen } from '@/components/ui';
import { palette } from '@/constants/theme';
import { useCatalogQuery, useUpdateCatalogItemMutation } from '@/hooks/use-catalog';
import { useSession } from '@/hooks/use-session';
import { describeError } from '@/shared/errors';

/** Everyone reads one mirror's details; the admin also edits their organisation's items here (the demo set is read-only). */
export default function CatalogItemScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const { user } = useSession();
  const units = useDisplayUnits();
  const catalog = useCatalogQuery();
  const update = useUpdateCatalogItemMutation();
  const item = catalog.data?.find((c) => String(c.id) === id) ?? null;
  if (!user) return null;
  if (catalog.isPending) return <ActivityIndicator color={palette.glass} accessibilityLabel="Loading the catalogue" />;
  if (catalog.isError)
    return (
      <Screen title="Catalogue">
        <Notice tone="stop">{describeError(catalog.error)}</Notice>
      </Screen>
    );
  if (!item) {
    return (
      <Screen title="Catalogue">
        <Notice tone="stop" testID="catalog-item-missing">
          There is no catalogue mirror with this number.
        </Notice>
      </Screen>
    );
  }
  return (
    <Screen
      title={item.name}
      lead={
        item.demo
          ? 'A demo item: invented for trying Sightfan, not a real product. The demo set is shared and read-only; add your own mirrors with “New mirror”.'
          : undefined
      }
      width="narrow"
    >
      <CatalogDetails item={item} units={units} />
      {user.role === 'admin' && !item.demo ? (
        <CatalogForm
          item={item}
          units={units}
          submitLabel="Save changes"
          onSubmit={async (values) => {
            await update.mutateAsync({ id: item.id, body: { ...bodyOf(values), version: item.version } });
            router.replace('/catalog');
          }}
        />
      ) : null}
    </Screen>
  );
}
