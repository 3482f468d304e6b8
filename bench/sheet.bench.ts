/**
 * Speed and size of the specification sheet. Budget (from the sheet's issue): a 10-placement sheet
 * renders in ≤ 300 ms median and weighs ≤ 500 KB. Printed beside a bare pdfkit page with the same
 * fonts, measured in the same run, so the cost of pdfkit itself is visible.
 */
import PDFDocument from 'pdfkit';
import { Bench } from 'tinybench';
import { buildSheetContent, contentHash, type SheetInput } from '../server/pdf/sheet-model';
import { renderSheet } from '../server/pdf/render-sheet';
import { NO_DEFAULT_FONT, registerSheetFonts } from '../server/pdf/fonts';
import { demoCatalogueDtos } from '../server/seeders/demo-catalogue';
import { DEMO_PROJECT } from '../server/seeders/demo-project';

const RENDER_BUDGET_MS = 300;
const SIZE_BUDGET_BYTES = 500 * 1024;
const DEG = Math.PI / 180;

export function tenPlacementInput(): SheetInput {
  const catalogue = demoCatalogueDtos();
  const viewers = DEMO_PROJECT.scene.viewers;
  const placements = Array.from({ length: 10 }, (_, i) => {
    const viewer = viewers[i % viewers.length];
    const at: [number, number] = [6 + i * 3, 10.05];
    // Aim each mirror halfway between its viewer and straight along the aisle, as an installer would.
    const toViewer = Math.atan2(viewer.positionM[1] - at[1], viewer.positionM[0] - at[0]);
    return {
      id: i + 1,
      label: `M${i + 1} bench`,
      catalogueItemId: (i % catalogue.length) + 1,
      customMirror: null,
      positionM: at,
      heightM: 2.6 + (i % 3) * 0.2,
      azimuthRad: toViewer + (i % 2 ? 20 : -20) * DEG,
      tiltDownRad: (20 + (i % 4) * 5) * DEG,
      viewerId: viewer.id,
      notes: '',
    };
  });
  return {
    project: {
      id: 1,
      name: 'Bench: ten mirrors',
      customer: 'Bench (demo)',
      site: 'Hall 2 (demo)',
      kind: 'site',
      notes: '',
      units: 'metric',
      scene: DEMO_PROJECT.scene,
    },
    owner: { name: 'Bench installer', email: 'bench@sightfan-demo.example', units: 'metric' },
    organization: 'Bench (demo)',
    placements,
    catalogue,
  };
}

/** The same ten mirrors with names in Hebrew, Arabic, Chinese and Japanese (fictional demo names). */
export function scriptsInput(): SheetInput {
  const input = tenPlacementInput();
  const labels = ['מראה צפון', 'مرآة المدخل', '北门镜', 'ひがしミラー', 'Dock (שער)'];
  return {
    ...input,
    project: {
      ...input.project,
      name: 'מחסן קירור — مستودع التبريد (demo)',
      customer: '冷库物流 (demo)',
      site: '東京倉庫 ひがし棟 (demo)',
    },
    owner: { ...input.owner, name: 'يوسف الحداد (demo)' },
    placements: input.placements.map((p, i) => ({ ...p, label: `${labels[i % labels.length]} ${i + 1}` })),
  };
}

function barePage(): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', font: NO_DEFAULT_FONT, info: { CreationDate: new Date(0) } });
  registerSheetFonts(doc);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  for (const f of ['regular', 'medium', 'semibold', 'bold', 'mono'] as const)
    doc.font(f).fontSize(10).text(`Sightfan bare page 0123456789 ${f}`);
  doc.end();
  return done;
}

export async function runSheetBench(): Promise<void> {
  const input = tenPlacementInput();
  const built = buildSheetContent(input);
  const rev = { number: 1, contentHash: contentHash(built.content), issuedAt: new Date(Date.UTC(2026, 0, 1)) };
  let sheetBytes = 0;
  let bareBytes = 0;
  let scriptsBytes = 0;
  const scripts = buildSheetContent(scriptsInput());
  const scriptsRev = { ...rev, contentHash: contentHash(scripts.content) };
  const bench = new Bench({ name: 'sheet', time: 3000, warmupTime: 500 });
  bench
    .add('render a 10-placement sheet (pdfkit, content ready)', async () => {
      sheetBytes = (await renderSheet(built.content, rev, 'a4')).length;
    })
    .add('build content (engine) + render, 10 placements', async () => {
      const b = buildSheetContent(input);
      await renderSheet(b.content, rev, 'a4');
    })
    .add('render the same sheet with names in Hebrew, Arabic, Chinese and Japanese', async () => {
      scriptsBytes = (await renderSheet(scripts.content, scriptsRev, 'a4')).length;
    })
    .add('bare pdfkit page, same fonts', async () => {
      bareBytes = (await barePage()).length;
    });
  await bench.run();
  console.log('specification sheet');
  for (const task of bench.tasks) {
    const res = task.result;
    if (!res || !('latency' in res)) {
      console.log(`  ${task.name}: no result`);
      continue;
    }
    const median = res.latency.p50 ?? NaN;
    const budget = task.name.startsWith('render a')
      ? ` (budget ${RENDER_BUDGET_MS} ms) ${median <= RENDER_BUDGET_MS ? 'meets' : 'MISSES'}`
      : '';
    console.log(`  ${task.name}: median ${median.toFixed(1)} ms${budget}`);
  }
  console.log(
    `  size: sheet ${(sheetBytes / 1024).toFixed(1)} KB (budget ${SIZE_BUDGET_BYTES / 1024} KB) ${sheetBytes <= SIZE_BUDGET_BYTES ? 'meets' : 'MISSES'}; bare page ${(bareBytes / 1024).toFixed(1)} KB`,
  );
  console.log(
    `  size: sheet in several scripts ${(scriptsBytes / 1024).toFixed(1)} KB (budget ${SIZE_BUDGET_BYTES / 1024} KB) ${scriptsBytes <= SIZE_BUDGET_BYTES ? 'meets' : 'MISSES'}`,
  );
}

if (require.main === module) void runSheetBench();
