import type { CatalogueItemDto, PlacementDto } from '@/shared/schemas';

/** An invented one-item catalogue: a 600 mm round mirror cut from a 0.8 m sphere. */
export const TEST_CATALOGUE: CatalogueItemDto[] = [
  {
    id: 1,
    code: 'T-600',
    name: 'Test round 600 (demo)',
    mirror: { shape: 'round', diameterM: 0.6, radiusM: 0.8 },
    material: '',
    reflectance: null,
    massKg: null,
    unitPriceMinor: 12900,
    currency: 'EUR',
    notes: '',
    active: true,
    demo: true,
    version: 1,
    updatedAt: '2025-01-01T00:00:00.000Z',
  },
];

/** One corner mirror (catalogue item 1) on a plan: the tests' common placement; override what a test needs. */
export function testPlacement(overrides: Partial<PlacementDto> = {}): PlacementDto {
  return {
    id: 7,
    projectId: 3,
    label: 'Corner',
    catalogueItemId: 1,
    customMirror: null,
    positionM: [0, 0],
    heightM: 2.6,
    azimuthRad: 0,
    tiltDownRad: 0.3,
    viewerId: 'v1',
    notes: '',
    version: 4,
    updatedAt: '2025-01-01T00:00:00.000Z',
    ...overrides,
  };
}
