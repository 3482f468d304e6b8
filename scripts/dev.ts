/**
 * `npm run dev`: the API on :8080 (restarting on server changes) and Expo's web dev server on
 * :8081 with fast refresh, pointed at that API. Ctrl-C stops both.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const root = path.resolve(__dirname, '..');
const apiPort = process.env.PORT ?? '8080';
const webOrigin = 'http://localhost:8081';
// `expo start` rewrites tsconfig.json#include; put it back when we stop.
const tsconfigPath = path.join(root, 'tsconfig.json');
const tsconfig = fs.readFileSync(tsconfigPath, 'utf8');

const children: ChildProcess[] = [
  spawn('npx', ['tsx', 'watch', '--clear-screen=false', 'server/index.ts'], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, PORT: apiPort, DEV_ORIGINS: webOrigin },
  }),
  spawn('npx', ['expo', 'start', '--web', '--port', '8081'], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, EXPO_PUBLIC_API_URL: `http://localhost:${apiPort}` },
  }),
];

const stop = () => {
  for (const c of children) c.kill('SIGINT');
  fs.writeFileSync(tsconfigPath, tsconfig);
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
for (const c of children) c.on('exit', stop);
