/**
 * `npm run backup [-- --to FOLDER]`: an online, consistent copy of the database (and uploads) while
 * the server runs. `npm run restore -- FOLDER [--force]`: puts a backup in place (server stopped).
 * Both read DATABASE_PATH like the server (default data/sightfan.sqlite).
 */
import path from 'node:path';
import { backupDatabase, restoreDatabase } from '../server/ops/backup';

async function main(): Promise<void> {
  const [command, ...args] = process.argv.slice(2);
  if (process.env.DATABASE_URL) {
    throw new Error(
      'DATABASE_URL names a PostgreSQL database: back it up with pg_dump -Fc and restore with pg_restore (README, "Run it on PostgreSQL"). npm run backup copies the SQLite file only.',
    );
  }
  const databasePath = path.resolve(process.env.DATABASE_PATH ?? 'data/sightfan.sqlite');
  if (command === 'backup') {
    const i = args.indexOf('--to');
    const into = i >= 0 && args[i + 1] ? args[i + 1] : 'backups';
    const { dir, manifest } = await backupDatabase(databasePath, into);
    const counts = Object.entries(manifest.rows)
      .map(([t, n]) => `${n} ${t}`)
      .join(', ');
    console.log(`backup written to ${dir} (${counts}${manifest.uploads ? '; uploads copied' : ''})`);
    return;
  }
  if (command === 'restore') {
    const dir = args.find((a) => !a.startsWith('--'));
    if (!dir) throw new Error('Name the backup folder: npm run restore -- backups/sightfan-20261202-170000');
    const manifest = await restoreDatabase(path.resolve(dir), databasePath, { force: args.includes('--force') });
    console.log(`restored ${databasePath} from the backup of ${manifest.createdAt}; start the server with npm start`);
    return;
  }
  throw new Error('usage: tsx scripts/backup.ts backup [--to FOLDER] | restore FOLDER [--force]');
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
