import { router } from 'expo-router';
import { useState } from 'react';
import { ActivityIndicator, Pressable, StyleSheet, View } from 'react-native';
import { compareMirrorsBySize, mirrorSizeText, priceText, SHAPE_LABELS, SHAPE_ORDER } from '@/components/placement/mirror-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { openOnEnterOrSpace } from '@/components/ui/link-keys';
import { Notice } from '@/components/ui/notice';
import { Segmented } from '@/components/ui/segmented';
import { AppText } from '@/components/ui/text';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { useIsWide } from '@/hooks/use-breakpoint';
import { useCatalogueQuery } from '@/hooks/use-catalogue';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import { describeError } from '@/shared/errors';
import { focalLength, sphereRadiusM } from '@/shared/optics';
import { mirrorOfSpec } from '@/shared/project-optics';
import type { CatalogueItemDto, MirrorSpec } from '@/shared/schemas';
import { formatLength, type UnitSystem } from '@/shared/units';

type ShapeFilter = 'all' | MirrorSpec['shape'];

/** Radius and focal length from the engine (a dome's sphere is the engine's model, not ours to redo). */
export function opticsOf(item: CatalogueItemDto): { radiusM: number; focalLengthM: number } {
  const radiusM = sphereRadiusM(mirrorOfSpec(item.mirror));
  return { radiusM, focalLengthM: focalLength(radiusM) };
}

const size = (m: number, units: UnitSystem) => formatLength(m, units, { kind: 'size' });

export function CatalogueList({ units, isAdmin }: { units: UnitSystem; isAdmin: boolean }) {
  const wide = useIsWide();
  const [shape, setShape] = useState<ShapeFilter>('all');
  const catalogue = useCatalogueQuery();
  const items = (catalogue.data ?? []).filter((c) => shape === 'all' || c.mirror.shape === shape);
  const sorted = [...items].sort(compareMirrorsBySize);

  return (
    <View style={styles.column}>
      <View style={styles.filter}>
        <AppText variant="label">Shape</AppText>
        <Segmented<ShapeFilter>
          label="Show shape"
          value={shape}
          onChange={setShape}
          stretch={!wide}
          options={[
            { value: 'all', label: 'All', testID: 'catalogue-filter-all' },
            ...SHAPE_ORDER.map((s) => ({ value: s, label: s === 'rect' ? 'Rect.' : SHAPE_LABELS[s], testID: `catalogue-filter-${s}` })),
          ]}
        />
      </View>
      {catalogue.isPending ? <ActivityIndicator color={palette.glass} accessibilityLabel="Loading the catalogue" /> : null}
      {catalogue.isError ? (
        <View style={styles.column}>
          <Notice tone="stop" testID="catalogue-error">
            {describeError(catalogue.error)}
          </Notice>
          <Button label="Try again" testID="catalogue-retry" variant="secondary" onPress={() => void catalogue.refetch()} />
        </View>
      ) : null}
      {catalogue.data && sorted.length === 0 ? (
        <AppText tone="muted" testID="catalogue-empty">
          {shape === 'all'
            ? isAdmin
              ? 'The catalogue is empty. Add the mirrors you sell with “New mirror”.'
              : 'The catalogue is empty; your administrator adds the mirrors you can choose.'
            : 'No mirror of this shape in the catalogue.'}
        </AppText>
      ) : null}
      {sorted.length > 0 ? (
        wide ? (
          <View style={styles.table} role="table" aria-label="Mirror catalogue">
            <View style={[styles.tr, styles.thead]} role="row">
              {COLUMNS.map((c) => (
                <AppText key={c.key} variant="caps" style={[styles.cell, { flex: c.flex }, c.right && styles.right]} role="columnheader">
                  {c.label}
                </AppText>
              ))}
            </View>
            {sorted.map((item) => (
              <CatalogueRow key={item.id} item={item} units={units} wide />
            ))}
          </View>
        ) : (
          <View style={styles.cards} role="list" aria-label="Mirror catalogue">
            {sorted.map((item) => (
              <CatalogueRow key={item.id} item={item} units={units} wide={false} />
            ))}
          </View>
        )
      ) : null}
    </View>
  );
}

type ColumnKey = 'shape' | 'code' | 'name' | 'size' | 'radius' | 'focal' | 'price';
const COLUMNS: readonly { key: ColumnKey; label: string; flex: number; right?: boolean }[] = [
  { key: 'shape', label: 'Shape', flex: 1.1 },
  { key: 'code', label: 'Code', flex: 1.2 },
  { key: 'name', label: 'Name', flex: 2.6 },
  { key: 'size', label: 'Size', flex: 1.8 },
  { key: 'radius', label: 'Radius of curv.', flex: 1.2, right: true },
  { key: 'focal', label: 'Focal length', flex: 1.2, right: true },
  { key: 'price', label: 'Price', flex: 1.1, right: true },
];

function CatalogueRow({ item, units, wide }: { item: CatalogueItemDto; units: UnitSystem; wide: boolean }) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  const o = opticsOf(item);
  const open = () => router.push(`/catalogue/${item.id}`);
  const cells: Record<ColumnKey, string> = {
    shape: SHAPE_LABELS[item.mirror.shape],
    code: item.code,
    name: item.name,
    size: mirrorSizeText(item.mirror, units),
    radius: size(o.radiusM, units),
    focal: size(o.focalLengthM, units),
    price: priceText(item),
  };
  // A wide row is a table row (its cells need one); a phone card is a link inside a list item.
  // Either way its name is the visible text, nothing left out.
  const row = (
    <Pressable
      testID={`catalogue-row-${item.id}`}
      role={wide ? 'row' : 'link'}
      onPress={open}
      onFocus={onFocus}
      onBlur={onBlur}
      style={({ hovered, pressed }) => [
        wide ? styles.tr : styles.card,
        (hovered || pressed) && styles.hover,
        !item.active && styles.inactive,
        focusVisible && focusRing,
      ]}
    >
      {wide ? (
        COLUMNS.map((c) => (
          <View key={c.key} style={[styles.cell, { flex: c.flex }]} role="cell">
            <AppText variant={c.key === 'code' || c.right ? 'mono' : 'body'} style={c.right ? styles.right : undefined}>
              {cells[c.key]}
            </AppText>
            {c.key === 'name' ? <Tags item={item} /> : null}
          </View>
        ))
      ) : (
        <>
          <View style={styles.cardHead}>
            <AppText variant="bodyStrong" style={styles.flex}>
              {item.name}
            </AppText>
            <AppText variant="bodyStrong">{cells.price}</AppText>
          </View>
          <AppText variant="small" tone="muted">{`${cells.shape} · ${item.code}`}</AppText>
          <AppText>{`${cells.size} · R ${cells.radius} · f ${cells.focal}`}</AppText>
          <Tags item={item} />
        </>
      )}
    </Pressable>
  );
  return wide ? (
    row
  ) : (
    <View role="listitem" onKeyDownCapture={openOnEnterOrSpace(open)}>
      {row}
    </View>
  );
}

function Tags({ item }: { item: CatalogueItemDto }) {
  if (!item.demo && item.active) return null;
  return (
    <View style={styles.tags}>
      {item.demo ? <Badge label="Demo" tone="beacon" testID={`catalogue-demo-${item.id}`} /> : null}
      {!item.active ? <Badge label="Withdrawn" tone="stop" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
  filter: { gap: spacing.xs },
  table: { borderWidth: 1, borderColor: palette.ruleSoft, borderRadius: radii.lg, backgroundColor: palette.card, overflow: 'hidden' },
  thead: { backgroundColor: palette.chalk, minHeight: 40 },
  tr: {
    flexDirection: 'row',
    alignItems: 'center',
    minHeight: layout.minTarget + 8,
    borderBottomWidth: 1,
    borderBottomColor: palette.ruleSoft,
    paddingHorizontal: spacing.sm,
  },
  cell: { paddingHorizontal: spacing.sm, paddingVertical: spacing.sm, gap: spacing.xxs },
  right: { textAlign: 'right' },
  cards: { gap: spacing.md },
  card: {
    gap: spacing.xs,
    padding: spacing.lg,
    backgroundColor: palette.card,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: palette.ruleSoft,
    minHeight: layout.minTarget,
  },
  cardHead: { flexDirection: 'row', gap: spacing.md, alignItems: 'baseline' },
  flex: { flex: 1 },
  hover: { backgroundColor: palette.glassSoft },
  inactive: { opacity: 0.7 },
  tags: { flexDirection: 'row', gap: spacing.xs },
});
