/**
 * Writes Expo Router's typed-route declarations (`.expo/types/router.d.ts`) without starting the
 * dev server, so `npm run typecheck` checks every href on a clean checkout too. The generator is
 * the one `expo start` runs; it lives in the CLI's own dependencies.
 */
import fs from 'node:fs';
import path from 'node:path';

const root = path.resolve(__dirname, '..');
const typesDir = path.join(root, '.expo', 'types');

type Generator = { regenerateDeclarations: (dir: string, options?: object) => void };

export async function writeRouteTypes(): Promise<void> {
  process.env.EXPO_ROUTER_APP_ROOT = path.join(root, 'app');
  fs.mkdirSync(typesDir, { recursive: true });
  const cli = path.dirname(require.resolve('@expo/cli/package.json', { paths: [path.dirname(require.resolve('expo/package.json'))] }));
  const generator = require.resolve('@expo/router-server/build/typed-routes', { paths: [cli] });
  const typed = (await import(generator)) as Generator;
  const target = path.join(typesDir, 'router.d.ts');
  const before = fs.existsSync(target) ? fs.statSync(target).mtimeMs : 0;
  typed.regenerateDeclarations(typesDir, {});
  // The generator debounces its write; wait for the file to change.
  await new Promise<void>((resolve, reject) => {
    const until = Date.now() + 10_000;
    const poll = () => {
      if (fs.existsSync(target) && fs.statSync(target).mtimeMs !== before) return resolve();
      if (Date.now() > until) return reject(new Error('Expo Router did not write .expo/types/router.d.ts'));
      setTimeout(poll, 50);
    };
    poll();
  });
}

if (require.main === module) {
  writeRouteTypes().then(
    () => console.log('route types: .expo/types/router.d.ts'),
    (e: unknown) => {
      console.error(e);
      process.exit(1);
    },
  );
}
