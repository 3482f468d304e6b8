/** Words for a mirror spec: shared by the catalogue list, the picker and the editor. */
import type { CatalogueItemDto, MirrorSpec } from '@/shared/schemas';
import { formatLength, formatMoney, type UnitSystem } from '@/shared/units';

import { PORTION_LABELS } from '@/shared/mirror-labels';

export { PORTION_LABELS, SHAPE_LABELS, SHAPE_ORDER } from '@/shared/mirror-labels';

const size = (m: number, units: UnitSystem) => formatLength(m, units, { kind: 'size' });

/** "Ø 600 mm", "600 mm × 400 mm", "Half dome, Ø 900 mm". */
export function mirrorSizeText(spec: MirrorSpec, units: UnitSystem): string {
  if (spec.shape === 'round') return `Ø ${size(spec.diameterM, units)}`;
  if (spec.shape === 'rect') return `${size(spec.widthM, units)} × ${size(spec.heightM, units)}`;
  return `${PORTION_LABELS[spec.portion]}, Ø ${size(spec.diameterM, units)}`;
}

/** The sphere's radius of curvature: stated for panels, half the diameter for a dome (the engine's model). */
export function mirrorRadiusM(spec: MirrorSpec): number {
  return spec.shape === 'dome' ? spec.diameterM / 2 : spec.radiusM;
}

export function radiusText(spec: MirrorSpec, units: UnitSystem): string {
  return `R ${size(mirrorRadiusM(spec), units)}`;
}

export function priceText(item: Pick<CatalogueItemDto, 'unitPriceMinor' | 'currency'>): string {
  return formatMoney(item.unitPriceMinor, item.currency);
}

/** One line for a catalogue item in a list or picker. */
export function catalogueLine(item: CatalogueItemDto, units: UnitSystem): string {
  return `${mirrorSizeText(item.mirror, units)} · ${radiusText(item.mirror, units)} · ${priceText(item)}`;
}
