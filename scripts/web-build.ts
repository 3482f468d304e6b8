/**
 * Builds the web app (`expo export`, then scripts/web-finish.ts: font preload, compressed copies;
 * then scripts/offline-build.ts: web manifest and service worker, whose precache sees the finished
 * index.html) when dist/ is missing or older than any source it is built from. Used by `npm start`
 * and `npm test`.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const root = path.resolve(__dirname, '..');
const SOURCES = [
  'app',
  'components',
  'hooks',
  'constants',
  'shared',
  'fonts',
  'assets',
  'public',
  'scripts/web-finish.ts',
  'scripts/offline-build.ts',
  'app.json',
  'package.json',
  'babel.config.js',
  'package-lock.json',
];

function newestMtime(p: string): number {
  let st: fs.Stats;
  try {
    st = fs.statSync(p);
  } catch {
    return 0;
  }
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const entry of fs.readdirSync(p)) newest = Math.max(newest, newestMtime(path.join(p, entry)));
  return newest;
}

export function webBuildIsFresh(): boolean {
  const built = path.join(root, 'dist', 'index.html');
  if (!fs.existsSync(built) || !fs.existsSync(path.join(root, 'dist', 'sw.js'))) return false;
  const builtAt = fs.statSync(built).mtimeMs;
  return SOURCES.every((s) => newestMtime(path.join(root, s)) <= builtAt);
}

export function ensureWebBuild(): void {
  if (webBuildIsFresh()) {
    console.log('web app: dist/ is up to date');
    return;
  }
  console.log('web app: building dist/ with expo export (about 40 s the first time)…');
  const started = Date.now();
  const env = { ...process.env, EXPO_PUBLIC_API_URL: '', CI: '1', EXPO_NO_TELEMETRY: '1' };
  const result = spawnSync('npx', ['expo', 'export', '--platform', 'web', '--output-dir', 'dist'], { cwd: root, stdio: 'inherit', env });
  const step = (script: string, before: ReturnType<typeof spawnSync>) =>
    before.status === 0 ? spawnSync('npx', ['tsx', script], { cwd: root, stdio: 'inherit', env }) : before;
  const finish = step('scripts/web-finish.ts', result);
  const offline = step('scripts/offline-build.ts', finish);
  if (offline.status !== 0) {
    console.error('web app: the build failed; see the messages above.');
    process.exit(offline.status ?? 1);
  }
  // Touch index.html so its time stamp marks the end of the build.
  const now = new Date();
  fs.utimesSync(path.join(root, 'dist', 'index.html'), now, now);
  console.log(`web app: built in ${((Date.now() - started) / 1000).toFixed(1)} s`);
}

if (require.main === module) ensureWebBuild();
