/**
 * Renders the demo project's sheet on A4 and US Letter, in metric and imperial, into
 * tests/e2e/artifacts/sample-sheets/ (git-ignored) for a person to look at:
 * `npx tsx scripts/sample-sheets.ts`, then `pdftoppm -png -r 60` on the files.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { CatalogueItemDto, SheetPaper, UnitSystem } from '../shared/schemas';
import { buildSheetContent, contentHash, sheetFilename, type SheetInput } from '../server/pdf/sheet-model';
import { renderSheet } from '../server/pdf/render-sheet';
import { DEMO_CATALOGUE } from '../server/seeders/demo-catalogue';
import { DEMO_PROJECT } from '../server/seeders/demo-project';

const DEG = Math.PI / 180;

export function demoSheetInput(units: UnitSystem): SheetInput {
  const catalogue: CatalogueItemDto[] = DEMO_CATALOGUE.map((c, i) => ({
    id: i + 1,
    code: c.code,
    name: c.name,
    mirror: c.mirror,
    material: c.material,
    reflectance: null,
    massKg: null,
    unitPriceMinor: c.unitPriceMinor,
    currency: 'EUR',
    notes: '',
    active: true,
    demo: true,
    version: 1,
    updatedAt: '2026-01-01T00:00:00.000Z',
  }));
  const placements = DEMO_PROJECT.placements.map((p, i) => ({
    id: i + 1,
    label: p.label,
    catalogueItemId: catalogue.find((c) => c.code === p.code)!.id,
    customMirror: null,
    positionM: p.positionM,
    heightM: p.heightM,
    azimuthRad: p.azimuthDeg * DEG,
    tiltDownRad: p.tiltDownDeg * DEG,
    viewerId: p.viewerId,
    notes: '',
  }));
  return {
    project: {
      id: 1,
      name: DEMO_PROJECT.name,
      customer: DEMO_PROJECT.customer,
      site: DEMO_PROJECT.site,
      kind: 'site',
      notes: DEMO_PROJECT.notes,
      units,
      scene: DEMO_PROJECT.scene,
    },
    owner: { name: 'Ines Installer (demo)', email: 'ines.installer@sightfan-demo.example', units },
    organization: 'Harbourline Mirrors (demo)',
    placements,
    catalogue,
  };
}

async function main(): Promise<void> {
  const out = path.resolve(__dirname, '..', 'tests', 'e2e', 'artifacts', 'sample-sheets');
  fs.mkdirSync(out, { recursive: true });
  for (const units of ['metric', 'imperial'] as const) {
    const { content } = buildSheetContent(demoSheetInput(units));
    const rev = { number: 1, contentHash: contentHash(content), issuedAt: new Date(Date.UTC(2026, 11, 2)) };
    for (const paper of ['a4', 'letter'] as SheetPaper[]) {
      const file = path.join(out, `${units}-${sheetFilename(content.project.name, 1, paper)}`);
      fs.writeFileSync(file, await renderSheet(content, rev, paper));
      console.log(file);
    }
  }
}

if (require.main === module) void main();
