/**
 * `npx tsx scripts/make-favicon.ts`: draws Sightfan's favicon and writes public/favicon.ico
 * (committed; expo export copies public/ to the site's root). Our own mark: a round steel-blue
 * mirror on its post with an amber fan of view opening from it, on an asphalt tile. Drawn here
 * with 4 × 4 samples a pixel and packed as an ICO holding 16, 32 and 48 px PNGs.
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { palette } from '../shared/palette';

type Rgba = [number, number, number, number];
const hex = (h: string, a = 255): Rgba => [parseInt(h.slice(1, 3), 16), parseInt(h.slice(3, 5), 16), parseInt(h.slice(5, 7), 16), a];

/** The mark in a 100 × 100 frame: the colour at a point, or null outside the tile. */
function colourAt(x: number, y: number): Rgba | null {
  const r = 18;
  const cx = Math.min(Math.max(x, r), 100 - r);
  const cy = Math.min(Math.max(y, r), 100 - r);
  if (x < 0 || y < 0 || x > 100 || y > 100 || (x - cx) ** 2 + (y - cy) ** 2 > r * r) return null;
  const d = Math.hypot(x - 40, y - 40);
  if (d <= 27) return hex(palette.glass);
  if (d <= 32) return hex(palette.chalk);
  // The fan: from the mirror's centre toward the right edge, 35° each side of level.
  const angle = Math.atan2(y - 40, x - 40);
  if (x > 40 && Math.abs(angle) <= (35 * Math.PI) / 180 && x <= 94) return hex(palette.beacon);
  if (x >= 35 && x <= 45 && y >= 50 && y <= 92) return hex(palette.onAsphaltMuted);
  return hex(palette.asphalt);
}

function draw(size: number): Buffer {
  const px = Buffer.alloc(size * size * 4);
  const n = 4;
  for (let j = 0; j < size; j++) {
    for (let i = 0; i < size; i++) {
      const sum = [0, 0, 0, 0];
      for (let sj = 0; sj < n; sj++) {
        for (let si = 0; si < n; si++) {
          const c = colourAt(((i + (si + 0.5) / n) / size) * 100, ((j + (sj + 0.5) / n) / size) * 100);
          if (!c) continue;
          for (let k = 0; k < 3; k++) sum[k] += c[k] * c[3];
          sum[3] += c[3];
        }
      }
      const o = (j * size + i) * 4;
      const a = sum[3] / (n * n);
      for (let k = 0; k < 3; k++) px[o + k] = sum[3] > 0 ? Math.round(sum[k] / sum[3]) : 0;
      px[o + 3] = Math.round(a);
    }
  }
  return px;
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(zlib.crc32(body));
  return Buffer.concat([len, body, crc]);
}

export function png(size: number, rgba: Buffer): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(size, 0);
  header.writeUInt32BE(size, 4);
  header[8] = 8; // bits per channel
  header[9] = 6; // RGBA
  const rows = Buffer.alloc(size * (size * 4 + 1));
  for (let j = 0; j < size; j++) rgba.copy(rows, j * (size * 4 + 1) + 1, j * size * 4, (j + 1) * size * 4);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', zlib.deflateSync(rows, { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** An ICO file holding PNG images (every current browser reads PNG entries). */
export function ico(images: { size: number; png: Buffer }[]): Buffer {
  const head = Buffer.alloc(6);
  head.writeUInt16LE(0, 0);
  head.writeUInt16LE(1, 2); // icon
  head.writeUInt16LE(images.length, 4);
  let offset = 6 + 16 * images.length;
  const entries = images.map(({ size, png: data }) => {
    const e = Buffer.alloc(16);
    e[0] = size >= 256 ? 0 : size;
    e[1] = size >= 256 ? 0 : size;
    e.writeUInt16LE(1, 4); // planes
    e.writeUInt16LE(32, 6); // bits per pixel
    e.writeUInt32LE(data.length, 8);
    e.writeUInt32LE(offset, 12);
    offset += data.length;
    return e;
  });
  return Buffer.concat([head, ...entries, ...images.map((i) => i.png)]);
}

if (require.main === module) {
  const out = path.resolve(__dirname, '..', 'public', 'favicon.ico');
  fs.mkdirSync(path.dirname(out), { recursive: true });
  const file = ico([16, 32, 48].map((size) => ({ size, png: png(size, draw(size)) })));
  fs.writeFileSync(out, file);
  console.log(`${path.relative(process.cwd(), out)}: ${file.length} bytes`);
}
