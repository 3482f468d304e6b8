/**
 * The last step of the web build, after `expo export` (`npm run build:web`, and
 * scripts/web-build.ts for `npm start` / `npm test`):
 *
 * 1. dist/index.html preloads the main face (Barlow regular, the app's body text), so it arrives
 *    beside the script instead of after it; the other faces load when a screen first uses them
 *    (constants/app-fonts.web.ts declares them with `font-display: swap`).
 * 2. It also preloads the route chunks every first visit needs (async routes load a screen's code
 *    only once the entry has run, one round trip later): both layouts and the sign-in screen.
 *    And it asks for the session (`GET /api/auth/session`, the app's start-up probe) from the HTML:
 *    the app's own fetch of it, made once the scripts have run, takes the preloaded answer instead
 *    of waiting one more round trip (same address, `credentials: 'include'` = `use-credentials`).
 * 3. The page shows the product's name and "Opening Sightfan…" in system type the moment the HTML
 *    arrives, before any script has run (React replaces it with the first screen).
 * 4. Every hashed file of the build (`_expo/`, `assets/`) that compresses gets a brotli (`.br`,
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
import { palette } from '../shared/palette';

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

/** The route chunks preloaded on every first visit: the root and signed-in layouts, and the sign-in screen. */
const FIRST_VISIT_CHUNKS = /^(_layout|sign-in)-[0-9a-f]+\.js$/;

/** index.html with preloads of the first visit's route chunks (once). */
export function withChunkPreloads(html: string, chunkPaths: string[]): string {
  const links = chunkPaths.map((href) => `<link rel="preload" href="${href}" as="script">`).filter((link) => !html.includes(link));
  if (links.length === 0) return html;
  return html.replace('</head>', `${links.map((l) => `  ${l}\n`).join('')}</head>`);
}

/** The app's start-up probe, preloaded as the app's API client asks for it (hooks/use-session.ts). */
const SESSION_PRELOAD = '<link rel="preload" href="/api/auth/session" as="fetch" crossorigin="use-credentials">';

/** index.html that asks for the session while the scripts download (once). */
export function withSessionPreload(html: string): string {
  if (html.includes(SESSION_PRELOAD)) return html;
  return html.replace('</head>', `  ${SESSION_PRELOAD}\n</head>`);
}

/** Adds the preloads (main face, first-visit chunks, session) and the splash to dist/index.html; returns the face's address. */
export function finishIndexHtml(distDir: string): string {
  const face = filesUnder(path.join(distDir, 'assets')).find(
    (f) => path.basename(f).startsWith(`${PRELOADED_FACE}.`) && f.endsWith('.ttf'),
  );
  if (!face) throw new Error(`the build has no ${PRELOADED_FACE} font file under assets/`);
  const href = `/${path.relative(distDir, face).split(path.sep).join('/')}`;
  const index = path.join(distDir, 'index.html');
  const chunkDir = path.join(distDir, '_expo', 'static', 'js', 'web');
  const chunks = fs.existsSync(chunkDir)
    ? fs
        .readdirSync(chunkDir)
        .filter((f) => FIRST_VISIT_CHUNKS.test(f))
        .sort()
    : [];
  const withPreloads = withChunkPreloads(
    withFontPreload(fs.readFileSync(index, 'utf8'), href),
    chunks.map((f) => `/_expo/static/js/web/${f}`),
  );
  fs.writeFileSync(index, withSplash(withSessionPreload(withPreloads)));
  return href;
}

const SPLASH_STYLE = `<style id="sightfan-splash-style">
      .sf-splash{flex:1;display:flex;flex-direction:column;align-items:center;justify-content:center;gap:8px;
        background:${palette.chalk};color:${palette.asphalt};font-family:system-ui,-apple-system,"Segoe UI",Roboto,Arial,sans-serif}
      .sf-splash b{font-size:28px;letter-spacing:.02em}.sf-splash span{font-size:17px;color:${palette.haze}}
    </style>`;
const SPLASH = '<div class="sf-splash" role="status"><b>Sightfan</b><span>Opening Sightfan…</span></div>';

/** index.html whose empty root shows the splash until the app's first render (once). */
export function withSplash(html: string): string {
  if (html.includes('sightfan-splash-style')) return html;
  if (!html.includes('<div id="root"></div>') || !html.includes('</head>'))
    throw new Error('dist/index.html has no empty root to put the splash in.');
  return html.replace('</head>', `  ${SPLASH_STYLE}\n</head>`).replace('<div id="root"></div>', `<div id="root">${SPLASH}</div>`);
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
  const href = finishIndexHtml(distDir);
  const t = compressHashedFiles(distDir);
  const kb = (n: number) => `${(n / 1024).toFixed(0)} KB`;
  console.log(`web finish: ${href} preloaded; ${t.files} files compressed, ${kb(t.raw)} → brotli ${kb(t.br)}, gzip ${kb(t.gz)}`);
}
