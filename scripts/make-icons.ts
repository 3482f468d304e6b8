/**
 * Draws Sightfan's app icons (the web manifest's, the home-screen icon) from our own SVG: a convex
 * mirror's disc on a post with the fan of what it shows, in the palette's colours. Rendered by
 * Debian's Chromium (playwright-core) and committed as PNGs in public/icons/, which `expo export`
 * copies to dist/icons/. Run again after changing the drawing: `npx tsx scripts/make-icons.ts`.
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { palette } from '../shared/palette';

const OUT = path.resolve(__dirname, '../public/icons');

/**
 * The drawing on a 100 × 100 square. `safe` shrinks it into the middle 80 % (a maskable icon may
 * be cut to a circle of that size); the background always fills the whole square.
 */
export function iconSvg(size: number, safe: boolean): string {
  const s = safe ? 0.72 : 0.9;
  const t = (100 - 100 * s) / 2;
  const radius = safe ? 0 : 18;
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}" viewBox="0 0 100 100">
  <rect width="100" height="100" rx="${radius}" fill="${palette.asphalt}"/>
  <g transform="translate(${t} ${t}) scale(${s})">
    <path d="M40 40 L96 14 L96 86 Z" fill="${palette.beacon}" opacity="0.9"/>
    <rect x="36" y="50" width="8" height="46" rx="2" fill="${palette.onAsphaltMuted}"/>
    <circle cx="40" cy="40" r="30" fill="${palette.glass}" stroke="${palette.onAsphalt}" stroke-width="5"/>
    <path d="M24 30 A20 20 0 0 1 40 20" fill="none" stroke="${palette.glassSoft}" stroke-width="5" stroke-linecap="round"/>
  </g>
</svg>`;
}

export const ICONS = [
  { file: 'icon-192.png', size: 192, safe: false },
  { file: 'icon-512.png', size: 512, safe: false },
  { file: 'maskable-192.png', size: 192, safe: true },
  { file: 'maskable-512.png', size: 512, safe: true },
  { file: 'apple-touch-icon.png', size: 180, safe: true },
] as const;

async function main() {
  fs.mkdirSync(OUT, { recursive: true });
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: ['--no-sandbox'] });
  try {
    for (const icon of ICONS) {
      const page = await browser.newPage({ viewport: { width: icon.size, height: icon.size }, deviceScaleFactor: 1 });
      await page.setContent(`<html><body style="margin:0;background:transparent">${iconSvg(icon.size, icon.safe)}</body></html>`);
      await page.locator('svg').screenshot({ path: path.join(OUT, icon.file), omitBackground: true });
      await page.close();
    }
    fs.writeFileSync(path.join(OUT, 'icon.svg'), `${iconSvg(512, false)}\n`);
  } finally {
    await browser.close();
  }
  console.log(`icons written to ${path.relative(process.cwd(), OUT)}`);
}

if (require.main === module) void main();
