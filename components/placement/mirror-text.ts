/** Words for a mirror spec: shared by the catalogue list, the picker and the editor. */
import type { CatalogueItemDto, MirrorSpec } from '@/shared/schemas';
import { formatLength, formatMoney, type UnitSystem } from '@/shared/units';

import { PORTION_LABELS, SHAPE_ORDER } from '@/shared/mirror-labels';

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

const PORTION_ORDER = { full: 0, half: 1, quarter: 2 } as const;

/**
 * Catalogue order for people: by shape, domes by portion, then by size as a number (300 mm before
 * 1000 mm, which sorting codes as text gets wrong), then radius, then name.
 */
export function compareMirrorsBySize(a: CatalogueItemDto, b: CatalogueItemDto): number {
  const key = (m: MirrorSpec): number[] => {
    const shape = SHAPE_ORDER.indexOf(m.shape);
    if (m.shape === 'round') return [shape, 0, m.diameterM, m.radiusM];
    if (m.shape === 'rect') return [shape, 0, m.widthM * m.heightM, m.radiusM];
    return [shape, PORTION_ORDER[m.portion], m.diameterM, 0];
  };
  const ka = key(a.mirror);
  const kb = key(b.mirror);
  for (let i = 0; i < ka.length; i++) if (ka[i] !== kb[i]) return ka[i] - kb[i];
  return a.name.localeCompare(b.name);
}

/** One line for a catalogue item in a list or picker. */
export function catalogueLine(item: CatalogueItemDto, units: UnitSystem): string {
  return `${mirrorSizeText(item.mirror, units)} · ${radiusText(item.mirror, units)} · ${priceText(item)}`;
}
