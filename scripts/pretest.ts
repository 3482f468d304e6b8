/**
 * Runs before Jest in `npm test`: makes sure the tools the end-to-end, PDF and PostgreSQL tests use
 * are here (Debian's chromium, poppler-utils and postgresql), installing them when running as root,
 * and that the web build the end-to-end tests serve is fresh.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import { ensureWebBuild } from './web-build';

/** PostgreSQL's server programs live in /usr/lib/postgresql/<major>/bin on Debian. */
const hasPostgres = () =>
  fs.existsSync('/usr/lib/postgresql') &&
  fs.readdirSync('/usr/lib/postgresql').some((v) => fs.existsSync(`/usr/lib/postgresql/${v}/bin/pg_ctl`));

const NEEDED: { pkg: string; present: () => boolean }[] = [
  { pkg: 'chromium', present: () => fs.existsSync('/usr/bin/chromium') },
  { pkg: 'poppler-utils', present: () => fs.existsSync('/usr/bin/pdftoppm') },
  { pkg: 'postgresql', present: hasPostgres },
];

const missing = NEEDED.filter((n) => !n.present());
if (missing.length) {
  const pkgs = missing.map((m) => m.pkg);
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot) {
    console.error(
      `Missing ${pkgs.join(' and ')}: run  sudo apt-get update && sudo apt-get install -y ${pkgs.join(' ')}  then npm test again.`,
    );
    process.exit(1);
  }
  console.log(`installing ${pkgs.join(', ')} with apt-get…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const update = spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  const install = update.status === 0 ? spawnSync('apt-get', ['install', '-y', '-qq', ...pkgs], { stdio: 'inherit', env }) : update;
  if (install.status !== 0 || missing.some((m) => !m.present())) {
    console.error(`Could not install ${pkgs.join(' and ')}; install them with apt-get and run npm test again.`);
    process.exit(1);
  }
}

ensureWebBuild();
