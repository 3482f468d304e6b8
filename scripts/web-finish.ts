/**
 * The last step of the web build, after `expo export` (`npm run build:web`, and
 * scripts/web-build.ts for `npm start` / `npm test`):
 *
 * 1. dist/index.html preloads the main face (Barlow regular, the app's body text), so it arrives
 *    beside the script instead of after it; the other faces load when a screen first uses them
 *    (constants/app-fonts.web.ts declares them with `font-display: swap`).
 * 2. Every hashed file of the build (`_expo/`, `assets/`) that compresses gets a brotli (`.br`,
 *    quality 11) and a gzip (`.gz`, level 9) copy beside it, which server/app.ts serves to
 *    browsers that accept them. HTML, the service worker and the manifest are left alone: they are
 *    small, may be rewritten by another build step, and are served revalidated.
 *
 * Runs again safely (the preload is added once; compressed copies are rewritten).
 * By hand: `npx tsx scripts/web-finish.ts [distDir]`.
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

const COMPRESSIBLE = /\.(js|css|json|ttf|otf|svg|map|txt|html|wasm)$/;
/** The face preloaded on every page: the body text's. */
export const PRELOADED_FACE = 'Barlow-Regular';

function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    return e.isDirectory() ? filesUnder(p) : [p];
  });
}

/** index.html with a preload of the main face's hashed file (once, however often it runs). */
export function withFontPreload(html: string, fontPath: string): string {
  const link = `<link rel="preload" href="${fontPath}" as="font" type="font/ttf" crossorigin>`;
  if (html.includes(link)) return html;
  if (!html.includes('</head>')) throw new Error('dist/index.html has no </head> to add the font preload to.');
  return html.replace('</head>', `  ${link}\n</head>`);
}

export function preloadMainFace(distDir: string): string {
  const face = filesUnder(path.join(distDir, 'assets')).find(
    (f) => path.basename(f).startsWith(`${PRELOADED_FACE}.`) && f.endsWith('.ttf'),
  );
  if (!face) throw new Error(`the build has no ${PRELOADED_FACE} font file under assets/`);
  const href = `/${path.relative(distDir, face).split(path.sep).join('/')}`;
  const index = path.join(distDir, 'index.html');
  fs.writeFileSync(index, withFontPreload(fs.readFileSync(index, 'utf8'), href));
  return href;
}

/** Writes `.br` and `.gz` beside each compressible hashed file; returns the sizes for the log. */
export function compressHashedFiles(distDir: string): { files: number; raw: number; br: number; gz: number } {
  const totals = { files: 0, raw: 0, br: 0, gz: 0 };
  for (const top of ['_expo', 'assets']) {
    for (const file of filesUnder(path.join(distDir, top))) {
      if (!COMPRESSIBLE.test(file)) continue;
      const raw = fs.readFileSync(file);
      const br = zlib.brotliCompressSync(raw, {
        params: {
          [zlib.constants.BROTLI_PARAM_QUALITY]: zlib.constants.BROTLI_MAX_QUALITY,
          [zlib.constants.BROTLI_PARAM_SIZE_HINT]: raw.length,
        },
      });
      const gz = zlib.gzipSync(raw, { level: 9 });
      // A copy no smaller than the file would only cost a header.
      if (br.length < raw.length) fs.writeFileSync(`${file}.br`, br);
      if (gz.length < raw.length) fs.writeFileSync(`${file}.gz`, gz);
      totals.files += 1;
      totals.raw += raw.length;
      totals.br += Math.min(br.length, raw.length);
      totals.gz += Math.min(gz.length, raw.length);
    }
  }
  return totals;
}

if (require.main === module) {
  const distDir = path.resolve(process.argv[2] ?? path.join(__dirname, '..', 'dist'));
  const href = preloadMainFace(distDir);
  const t = compressHashedFiles(distDir);
  const kb = (n: number) => `${(n / 1024).toFixed(0)} KB`;
  console.log(`web finish: ${href} preloaded; ${t.files} files compressed, ${kb(t.raw)} → brotli ${kb(t.br)}, gzip ${kb(t.gz)}`);
}
