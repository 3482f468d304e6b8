/**
 * Uploads: a 12-megapixel phone photo through the whole processing (sniff, decode, turn upright
 * from EXIF, strip, re-encode, thumbnail), and a 10-page PDF plan's first page drawn on the PDF
 * worker. Budgets from issue 16: ≤ 1 s and ≤ 2 s median. The inputs are made here (a synthetic
 * photo with EXIF orientation and GPS; a drawn demo plan of racks, walls and labels on A1 pages).
 */
import sharp from 'sharp';
import PDFDocument from 'pdfkit';
import { processUpload } from '../server/modules/files/process-upload';
import { createPdfWork } from '../server/workers/pdf-pool';

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** 4032 × 3024 (12.2 MP, a common phone camera size, docs/sources.md *Uploaded files*): smooth light with fine grain, like a photo of a wall. */
async function phonePhoto(): Promise<Buffer> {
  const width = 4032;
  const height = 3024;
  const raw = Buffer.alloc(width * height * 3);
  let seed = 7;
  for (let y = 0; y < height; y++)
    for (let x = 0; x < width; x++) {
      seed = (seed * 1103515245 + 12345) & 0x7fffffff;
      const grain = ((seed >> 16) & 15) - 8;
      const i = (y * width + x) * 3;
      raw[i] = Math.max(0, Math.min(255, 90 + (x * 120) / width + grain));
      raw[i + 1] = Math.max(0, Math.min(255, 100 + (y * 100) / height + grain));
      raw[i + 2] = Math.max(0, Math.min(255, 80 + ((x + y) * 60) / (width + height) + grain));
    }
  return sharp(raw, { raw: { width, height, channels: 3 } })
    .withExif({
      IFD0: { Make: 'Demo', Model: 'Bench camera' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' },
    })
    .withMetadata({ orientation: 6 })
    .jpeg({ quality: 92 })
    .toBuffer();
}

/** Ten A1 landscape pages, each a warehouse plan: 40 rack rows, walls, a grid, 200 labels. */
function tenPagePlan(): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A1', layout: 'landscape', autoFirstPage: false });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  for (let p = 1; p <= 10; p++) {
    doc.addPage();
    const w = doc.page.width;
    const h = doc.page.height;
    doc.lineWidth(0.25).strokeColor('#999');
    for (let x = 40; x < w - 40; x += 20) doc.moveTo(x, 40).lineTo(x, h - 40);
    for (let y = 40; y < h - 40; y += 20) doc.moveTo(40, y).lineTo(w - 40, y);
    doc.stroke();
    doc
      .lineWidth(4)
      .strokeColor('#000')
      .rect(40, 40, w - 80, h - 80)
      .stroke();
    doc.lineWidth(1);
    for (let r = 0; r < 40; r++) doc.rect(80 + r * 55, 120, 30, h - 300).fillAndStroke('#ddd', '#000');
    doc.fillColor('#000').fontSize(8);
    for (let i = 0; i < 200; i++)
      doc.text(`R${i % 40}-${Math.floor(i / 40)}`, 82 + (i % 40) * 55, 110 + Math.floor(i / 40) * 300, { lineBreak: false });
    doc.fontSize(28).text(`Demo warehouse, level ${p}`, 60, h - 120, { lineBreak: false });
  }
  doc.end();
  return done;
}

export async function runUploadsBench(): Promise<void> {
  const pdfWork = createPdfWork({ budgetMs: 60_000 });
  const photo = await phonePhoto();
  const photoRuns: number[] = [];
  let out = { widthPx: 0, heightPx: 0, bytes: 0 };
  for (let i = 0; i < 7; i++) {
    const t = performance.now();
    const done = await processUpload(photo, 'photo', 1, pdfWork);
    photoRuns.push(performance.now() - t);
    out = { widthPx: done.widthPx, heightPx: done.heightPx, bytes: done.data.length };
  }
  console.log('uploads: a 12-megapixel phone photo (4032 × 3024 JPEG, EXIF orientation 6 and GPS)');
  console.log(
    `  sniff, decode, turn upright, strip, re-encode, thumbnail: median ${median(photoRuns).toFixed(0)} ms over ${photoRuns.length} (budget 1000 ms); ${(photo.length / 1e6).toFixed(1)} MB in, ${out.widthPx} × ${out.heightPx} and ${(out.bytes / 1e6).toFixed(1)} MB out`,
  );

  const plan = await tenPagePlan();
  const first = performance.now();
  await pdfWork.rasterise(plan, 1);
  const cold = performance.now() - first;
  const pdfRuns: number[] = [];
  let size = '';
  for (let i = 0; i < 5; i++) {
    const t = performance.now();
    const drawn = await pdfWork.rasterise(plan, 1);
    pdfRuns.push(performance.now() - t);
    size = `${drawn.widthPx} × ${drawn.heightPx}`;
  }
  await pdfWork.close();
  console.log(`uploads: a 10-page PDF plan (A1 pages, ${(plan.length / 1e3).toFixed(0)} kB), first page drawn on the PDF worker`);
  console.log(
    `  median ${median(pdfRuns).toFixed(0)} ms over ${pdfRuns.length} (budget 2000 ms) at ${size} px; the first, with the worker thread starting, ${cold.toFixed(0)} ms`,
  );
}

if (require.main === module) void runUploadsBench();
