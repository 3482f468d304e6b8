import type { CatalogueItemDto, MirrorSpec } from '../../shared/schemas';

/**
 * DEMO DATA — an invented catalogue for the demo organisation. Codes, names, prices, masses and
 * radii are made up for the demo (typical of the trade's range, not any maker's figures).
 */
export interface DemoItem {
  code: string;
  name: string;
  mirror: MirrorSpec;
  material: string;
  reflectance: number;
  massKg: number;
  unitPriceMinor: number;
}

const round = (mm: number, rMm: number, price: number, mass: number, material = 'polycarbonate'): DemoItem => ({
  code: `DEMO-R${mm}`,
  name: `Round convex mirror ${mm} mm (demo)`,
  mirror: { shape: 'round', diameterM: mm / 1000, radiusM: rMm / 1000 },
  material,
  reflectance: material === 'stainless steel' ? 0.6 : 0.8,
  massKg: mass,
  unitPriceMinor: price,
});

const rect = (w: number, h: number, rMm: number, price: number, mass: number): DemoItem => ({
  code: `DEMO-P${w}x${h}`,
  name: `Rectangular convex panel ${w} × ${h} mm (demo)`,
  mirror: { shape: 'rect', widthM: w / 1000, heightM: h / 1000, radiusM: rMm / 1000 },
  material: 'acrylic',
  reflectance: 0.8,
  massKg: mass,
  unitPriceMinor: price,
});

const dome = (portion: 'full' | 'half' | 'quarter', mm: number, price: number, mass: number): DemoItem => ({
  code: `DEMO-D${portion[0].toUpperCase()}${mm}`,
  name: `${portion[0].toUpperCase()}${portion.slice(1)} dome ${mm} mm (demo)`,
  mirror: { shape: 'dome', portion, diameterM: mm / 1000 },
  material: 'acrylic',
  reflectance: 0.8,
  massKg: mass,
  unitPriceMinor: price,
});

export const DEMO_CATALOGUE: DemoItem[] = [
  round(300, 600, 4900, 1.1),
  round(400, 800, 6400, 1.6),
  round(500, 1000, 8900, 2.4),
  round(600, 1200, 11900, 3.3),
  round(600, 1200, 18900, 5.8, 'stainless steel'),
  round(800, 1600, 16900, 5.5),
  round(900, 1800, 21900, 7.0),
  round(1000, 2000, 27900, 8.8),
  round(1200, 2400, 39900, 12.5),
  rect(400, 600, 1200, 9900, 2.6),
  rect(600, 800, 1600, 15900, 4.4),
  rect(800, 1000, 2000, 24900, 7.1),
  dome('full', 460, 12900, 1.9),
  dome('full', 610, 17900, 3.2),
  dome('full', 910, 32900, 6.8),
  dome('half', 610, 12900, 1.8),
  dome('half', 910, 22900, 3.9),
  dome('quarter', 460, 8900, 0.9),
  dome('quarter', 610, 11900, 1.5),
  dome('quarter', 910, 19900, 3.1),
];
// The stainless 600 mm needs its own code.
DEMO_CATALOGUE[4] = { ...DEMO_CATALOGUE[4], code: 'DEMO-R600-SS', name: 'Round convex mirror 600 mm, stainless steel (demo)' };

/**
 * The demo catalogue as the API lists it, numbered 1…n as a fresh database numbers it: for code
 * that needs catalogue items without a database (benches, engine and sheet tests).
 */
export function demoCatalogueDtos(items: readonly DemoItem[] = DEMO_CATALOGUE): CatalogueItemDto[] {
  return items.map((c, i) => ({
    ...c,
    id: i + 1,
    currency: 'EUR',
    notes: '',
    active: true,
    demo: true,
    version: 1,
    updatedAt: '2026-01-01T00:00:00.000Z',
  }));
}
