/**
 * Real bytes for the upload tests, made here by sharp and pdfkit (no copied images): photos with
 * and without EXIF, plans as PNG and PDF, and the hostile files the server must refuse.
 */
import zlib from 'node:zlib';
import sharp from 'sharp';
import PDFDocument from 'pdfkit';

/** A noisy JPEG (noise so a cut lands inside the compressed scan, not in padding). */
export async function jpeg(width: number, height: number, exif?: Record<string, Record<string, string>>): Promise<Buffer> {
  const raw = Buffer.alloc(width * height * 3);
  let seed = 12345;
  for (let i = 0; i < raw.length; i++) {
    seed = (seed * 1103515245 + 12345) & 0x7fffffff;
    raw[i] = (seed >> 16) & 0xff;
  }
  let img = sharp(raw, { raw: { width, height, channels: 3 } });
  if (exif) img = img.withExif(exif);
  return img.jpeg({ quality: 90 }).toBuffer();
}

/** A plain drawing as a PNG: white, with a black band across the top tenth (to see which way is up). */
export async function png(width: number, height: number): Promise<Buffer> {
  const band = await sharp({ create: { width, height: Math.max(1, Math.round(height / 10)), channels: 3, background: '#000' } })
    .png()
    .toBuffer();
  return sharp({ create: { width, height, channels: 3, background: '#fff' } })
    .composite([{ input: band, top: 0, left: 0 }])
    .png()
    .toBuffer();
}

/** A PDF with `pages` pages of the given sizes in points (a list is cycled), each saying its number. */
export function pdf(pages: number, sizes: [number, number][] = [[595.28, 841.89]]): Promise<Buffer> {
  const doc = new PDFDocument({ size: sizes[0], autoFirstPage: true, compress: true });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  for (let i = 1; i <= pages; i++) {
    if (i > 1) doc.addPage({ size: sizes[(i - 1) % sizes.length] });
    doc.rect(36, 36, 200, 100).stroke();
    doc.fontSize(18).text(`Demo plan, page ${i}`, 48, 60);
  }
  doc.end();
  return done;
}

/** A PNG whose header claims `width` × `height` pixels over a single row of data (a decompression bomb's header). */
export async function pngClaiming(width: number, height: number): Promise<Buffer> {
  const real = await sharp({ create: { width: 1, height: 1, channels: 3, background: '#fff' } })
    .png()
    .toBuffer();
  const out = Buffer.from(real);
  // IHDR's data starts at byte 16 (8 signature + 4 length + 4 type); its CRC follows 13 bytes later
  // (docs/sources.md, *Uploaded files*).
  out.writeUInt32BE(width, 16);
  out.writeUInt32BE(height, 20);
  out.writeUInt32BE(zlib.crc32(out.subarray(12, 29)), 29);
  return out;
}

/** The first bytes of a Linux executable (ELF) and of a Windows one (MZ), padded. */
export const elf = () => Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(2000, 0x90)]);
export const mz = () => Buffer.concat([Buffer.from('MZ\x90\x00\x03\x00\x00\x00', 'latin1'), Buffer.alloc(2000, 0x00)]);

export const svgWithScript = () =>
  Buffer.from(
    '<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="100" height="100"><script>alert(document.cookie)</script><rect width="100" height="100"/></svg>',
  );

/** A local file header of a zip and an HTML page with a script, to hang after an image. */
export const zipAndHtmlTail = () =>
  Buffer.concat([
    Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0, 0, 0, 8, 0]),
    Buffer.from('payload.html'),
    Buffer.from('<html><body><script>alert("polyglot")</script></body></html>'),
  ]);
