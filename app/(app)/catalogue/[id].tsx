import { router, useLocalSearchParams } from 'expo-router';
import { ActivityIndicator } from 'react-native';
import { bodyOf, CatalogueForm } from '@/components/catalogue/catalogue-form';
import { CatalogueDetails } from '@/components/catalogue/catalogue-details';
import { useDisplayUnits } from '@/components/placement/use-display-units';
import { Notice, Screen } from '@/components/ui';
import { palette } from '@/constants/theme';
import { useCatalogueQuery, useUpdateCatalogueItemMutation } from '@/hooks/use-catalogue';
import { useSession } from '@/hooks/use-session';
import { describeError } from '@/shared/errors';

/** Everyone reads one mirror's details; the admin also edits their organisation's items here (the demo set is read-only). */
export default function CatalogueItemScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const { user } = useSession();
  const units = useDisplayUnits();
  const catalogue = useCatalogueQuery();
  const update = useUpdateCatalogueItemMutation();
  const item = catalogue.data?.find((c) => String(c.id) === id) ?? null;
  if (!user) return null;
  if (catalogue.isPending) return <ActivityIndicator color={palette.glass} accessibilityLabel="Loading the catalogue" />;
  if (catalogue.isError)
    return (
      <Screen title="Catalogue">
        <Notice tone="stop">{describeError(catalogue.error)}</Notice>
      </Screen>
    );
  if (!item) {
    return (
      <Screen title="Catalogue">
        <Notice tone="stop" testID="catalogue-item-missing">
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
      <CatalogueDetails item={item} units={units} />
      {user.role === 'admin' && !item.demo ? (
        <CatalogueForm
          item={item}
          units={units}
          submitLabel="Save changes"
          onSubmit={async (values) => {
            await update.mutateAsync({ id: item.id, body: { ...bodyOf(values), version: item.version } });
            router.replace('/catalogue');
          }}
        />
      ) : null}
    </Screen>
  );
}
