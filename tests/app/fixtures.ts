import type { CatalogueItemDto, PlacementDto, ProjectDto, ProjectSummaryDto, Scene, UserDto } from '@/shared/schemas';
import { DEMO_CATALOGUE } from '../../server/seeders/demo-catalogue';
import { DEMO_PROJECT } from '../../server/seeders/demo-project';
import type { DemoVehicleJob } from '../../server/seeders/demo-vehicles';

const STAMP = '2026-01-01T00:00:00.000Z';
const DEG = Math.PI / 180;

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

/** The seeded demo catalogue as the API lists it (ids in seed order). */
export function demoCatalogueDtos(): CatalogueItemDto[] {
  return DEMO_CATALOGUE.map((d, i) => ({
    id: i + 1,
    code: d.code,
    name: d.name,
    mirror: d.mirror,
    material: d.material,
    reflectance: d.reflectance,
    massKg: d.massKg,
    unitPriceMinor: d.unitPriceMinor,
    currency: 'EUR',
    notes: '',
    active: true,
    demo: true,
    version: 1,
    updatedAt: STAMP,
  }));
}

/**
 * The seeded demo project's placements with the catalogue ids of `demoCatalogueDtos`; a code the
 * catalogue does not hold fails here rather than quietly testing another mirror.
 */
export function demoPlacementDtos(projectId: number): PlacementDto[] {
  const catalogue = demoCatalogueDtos();
  return DEMO_PROJECT.placements.map((p, i) => {
    const item = catalogue.find((c) => c.code === p.code);
    if (!item) throw new Error(`The demo project uses ${p.code}, which the demo catalogue does not hold.`);
    return {
      id: i + 1,
      projectId,
      label: p.label,
      catalogueItemId: item.id,
      customMirror: null,
      positionM: p.positionM,
      heightM: p.heightM,
      azimuthRad: (p.azimuthDeg * Math.PI) / 180,
      tiltDownRad: (p.tiltDownDeg * Math.PI) / 180,
      viewerId: p.viewerId,
      notes: '',
      version: 1,
      updatedAt: STAMP,
    };
  });
}

/**
 * An invented aisle for `testPlacement`'s mirror (at the origin, 2.6 m up, aimed along +x): a
 * driver (eye 1.6 m) 6 m in front of it and a 6 × 6 m crossing for adults around them.
 */
export const TEST_AISLE_SCENE: Scene = {
  walls: [],
  zones: [
    {
      id: 'z1',
      name: 'Crossing',
      polygonM: [
        [2, -3],
        [8, -3],
        [8, 3],
        [2, 3],
      ],
      target: { kind: 'adult' },
    },
  ],
  viewers: [{ id: 'v1', name: 'Driver', positionM: [6, 0], eyeHeightM: 1.6 }],
};

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

/** A project's list row as the API sends it: an invented site job being drawn up; override what a test needs. */
export function testProjectSummary(overrides: Partial<ProjectSummaryDto> = {}): ProjectSummaryDto {
  return {
    id: 3,
    name: 'Test aisle (demo)',
    customer: '',
    site: '',
    kind: 'site',
    state: 'drawing_up',
    reviewerId: null,
    reviewerName: null,
    sentAt: null,
    approval: null,
    openCommentCount: 0,
    ownerId: 1,
    ownerName: 'Ines',
    placementCount: 0,
    version: 1,
    createdAt: STAMP,
    updatedAt: STAMP,
    ...overrides,
  };
}

/**
 * A whole project as the API sends it (editable, no walls, zones or viewers unless given); the
 * mirror count follows the placements given.
 */
export function testProject(overrides: Partial<ProjectDto> = {}): ProjectDto {
  const placements = overrides.placements ?? [];
  return {
    ...testProjectSummary({ placementCount: placements.length }),
    units: null,
    notes: '',
    scene: { walls: [], zones: [], viewers: [] },
    placements,
    canEdit: true,
    ...overrides,
  };
}

/** An invented person at the invented domain fitters-demo.example: an installer unless overridden. */
export function testUser(overrides: Partial<UserDto> = {}): UserDto {
  return {
    id: 3,
    email: 'ines@fitters-demo.example',
    name: 'Ines Okafor',
    role: 'installer',
    disabled: false,
    units: 'metric',
    organizationId: 1,
    organizationName: 'Fitters (demo)',
    hasPassword: true,
    createdAt: STAMP,
    updatedAt: STAMP,
    ...overrides,
  };
}

/** A seeded demo vehicle job's mirrors as the API sends them, numbered from `firstId`. */
export function demoVehiclePlacementDtos(job: DemoVehicleJob, projectId: number, firstId: number): PlacementDto[] {
  return job.placements.map((m, i) => ({
    id: firstId + i,
    projectId,
    label: m.label,
    catalogueItemId: null,
    customMirror: m.mirror,
    positionM: m.positionM,
    heightM: m.heightM,
    azimuthRad: m.azimuthDeg * DEG,
    tiltDownRad: m.tiltDownDeg * DEG,
    viewerId: null,
    notes: '',
    mirrorClass: m.mirrorClass,
    servesFieldIds: m.servesFieldIds,
    version: 1,
    updatedAt: STAMP,
  }));
}
