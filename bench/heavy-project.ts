/** The heavy site (bench/heavy-scene.ts) as a sheet-model input, for benches that skip HTTP and the database. */
import type { CatalogueItemDto } from '../shared/schemas';
import type { SheetInput } from '../server/pdf/sheet-model';
import { heavyPlacements, heavyScene, type HeavyCounts } from './heavy-scene';

export { heavyPlacements, heavyScene, type HeavyCounts };

/** The same project as a sheet-model input, for benches that skip HTTP and the database. */
export function heavySheetInput(c: HeavyCounts, catalogue: readonly CatalogueItemDto[]): SheetInput {
  return {
    project: {
      id: 1,
      name: 'Heavy hall (demo)',
      customer: 'Bench (demo)',
      site: 'Hall 9 (demo)',
      kind: 'site',
      notes: '',
      units: 'metric',
      scene: heavyScene(c),
    },
    owner: { name: 'Bench installer', email: 'bench@sightfan-demo.example', units: 'metric' },
    organization: 'Bench (demo)',
    placements: heavyPlacements(c, catalogue[0].id).map((p, i) => ({
      id: i + 1,
      label: p.label,
      catalogueItemId: p.catalogueItemId ?? null,
      customMirror: null,
      positionM: p.positionM,
      heightM: p.heightM,
      azimuthRad: p.azimuthRad,
      tiltDownRad: p.tiltDownRad,
      viewerId: p.viewerId ?? null,
      notes: '',
    })),
    catalogue,
  };
}
