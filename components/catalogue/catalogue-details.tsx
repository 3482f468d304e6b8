import { StyleSheet, View } from 'react-native';
import { mirrorSizeText, priceText, SHAPE_LABELS } from '@/components/placement/mirror-text';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/constants/theme';
import type { CatalogueItemDto } from '@/shared/schemas';
import { formatLength, formatPercent, type UnitSystem } from '@/shared/units';
import { opticsOf } from './catalogue-list';

/** One mirror's facts, read-only: what an installer or reviewer needs to choose it. */
export function CatalogueDetails({ item, units }: { item: CatalogueItemDto; units: UnitSystem }) {
  const o = opticsOf(item);
  const size = (m: number) => formatLength(m, units, { kind: 'size' });
  const rows: [string, string][] = [
    ['Code', item.code],
    ['Shape', SHAPE_LABELS[item.mirror.shape]],
    ['Size', mirrorSizeText(item.mirror, units)],
    ['Radius of curvature', size(o.radiusM)],
    ['Focal length', size(o.focalLengthM)],
    ['Unit price', priceText(item)],
    ['Material', item.material || '—'],
    ['Reflectance', item.reflectance != null ? formatPercent(item.reflectance) : '—'],
    ['Mass', item.massKg != null ? `${item.massKg} kg` : '—'],
    ['Offered', item.active ? 'Yes' : 'No, withdrawn'],
  ];
  return (
    <Card testID="catalogue-details">
      {rows.map(([k, v]) => (
        <View key={k} style={styles.row}>
          <AppText tone="muted">{k}</AppText>
          <AppText variant="bodyStrong" style={styles.value}>
            {v}
          </AppText>
        </View>
      ))}
      {item.notes ? <AppText>{item.notes}</AppText> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', justifyContent: 'space-between', gap: spacing.md, flexWrap: 'wrap' },
  value: { textAlign: 'right', flexShrink: 1 },
});
