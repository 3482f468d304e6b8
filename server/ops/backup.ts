/**
 * Online, consistent backups of the embedded database, and their restore.
 *
 * A backup is a folder: `database.sqlite` written by SQLite's `VACUUM INTO` (a consistent snapshot
 * taken inside one read transaction, so it is safe while the server runs and writes), the data
 * folder's `uploads/` when there is one, and `manifest.json` (when, from where, the applied
 * migrations and the row counts, so a restore can be checked).
 *
 * A restore refuses to overwrite an existing database unless told to, checks the copy with
 * `PRAGMA integrity_check` before it is put in place, and puts it in place by rename (never a
 * half-written database file).
 */
import fs from 'node:fs';
import path from 'node:path';
import { MikroORM } from '@mikro-orm/sqlite';
import { ormOptions } from '../orm-options';

export interface BackupManifest {
  format: 'sightfan-backup-1';
  createdAt: string;
  sourceDatabase: string;
  migrations: string[];
  rows: Record<string, number>;
  uploads: boolean;
}

const COUNTED_TABLES = ['organization', 'user', 'project', 'placement', 'mirror_model', 'sheet_revision'];

async function openPlain(databasePath: string): Promise<MikroORM> {
  return MikroORM.init({ ...ormOptions(databasePath), allowGlobalContext: true });
}

async function facts(orm: MikroORM): Promise<Pick<BackupManifest, 'migrations' | 'rows'>> {
  const conn = orm.em.getConnection();
  const migrations = (await conn.execute<{ name: string }[]>('select name from mikro_orm_migrations order by id')).map((r) => r.name);
  const tables = new Set(
    (await conn.execute<{ name: string }[]>("select name from sqlite_master where type = 'table'")).map((r) => r.name),
  );
  const rows: Record<string, number> = {};
  for (const t of COUNTED_TABLES) {
    if (tables.has(t)) rows[t] = (await conn.execute<{ n: number }[]>(`select count(*) as n from "${t}"`))[0].n;
  }
  return { migrations, rows };
}

const stamp = (d: Date) => d.toISOString().replace(/[-:]/g, '').replace('T', '-').slice(0, 15);

/** Writes a backup folder under `intoDir` and returns its path. */
export async function backupDatabase(
  databasePath: string,
  intoDir: string,
  now = new Date(),
): Promise<{ dir: string; manifest: BackupManifest }> {
  if (!fs.existsSync(databasePath)) throw new Error(`There is no database at ${databasePath} to back up.`);
  const dir = path.join(path.resolve(intoDir), `sightfan-${stamp(now)}`);
  if (fs.existsSync(dir)) throw new Error(`${dir} already exists; wait a second or choose another folder.`);
  fs.mkdirSync(dir, { recursive: true });
  const target = path.join(dir, 'database.sqlite');
  const orm = await openPlain(databasePath);
  try {
    const conn = orm.em.getConnection();
    await conn.execute('PRAGMA busy_timeout = 5000');
    // A parameter is not allowed here; the path is quoted as an SQL string literal instead.
    await conn.execute(`VACUUM INTO '${target.replace(/'/g, "''")}'`);
  } finally {
    await orm.close(true);
  }
  const copy = await openPlain(target);
  let manifest: BackupManifest;
  try {
    const uploads = path.join(path.dirname(databasePath), 'uploads');
    const hasUploads = fs.existsSync(uploads);
    if (hasUploads) fs.cpSync(uploads, path.join(dir, 'uploads'), { recursive: true });
    manifest = {
      format: 'sightfan-backup-1',
      createdAt: now.toISOString(),
      sourceDatabase: databasePath,
      ...(await facts(copy)),
      uploads: hasUploads,
    };
  } finally {
    await copy.close(true);
  }
  fs.writeFileSync(path.join(dir, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);
  return { dir, manifest };
}

/** Puts a backup folder's database (and uploads) in place at `databasePath`. The server must be stopped. */
export async function restoreDatabase(backupDir: string, databasePath: string, opts: { force?: boolean } = {}): Promise<BackupManifest> {
  const manifestPath = path.join(backupDir, 'manifest.json');
  const source = path.join(backupDir, 'database.sqlite');
  if (!fs.existsSync(manifestPath) || !fs.existsSync(source))
    throw new Error(`${backupDir} is not a Sightfan backup (manifest.json and database.sqlite expected).`);
  const manifest = JSON.parse(fs.readFileSync(manifestPath, 'utf8')) as BackupManifest;
  if (manifest.format !== 'sightfan-backup-1') throw new Error(`${backupDir} was written by an unknown backup format.`);
  if (fs.existsSync(databasePath) && !opts.force) {
    throw new Error(`A database already exists at ${databasePath}. Stop the server and pass --force to replace it.`);
  }
  fs.mkdirSync(path.dirname(databasePath), { recursive: true });
  const staging = `${databasePath}.restoring`;
  fs.copyFileSync(source, staging);
  const orm = await openPlain(staging);
  try {
    const [check] = await orm.em.getConnection().execute<{ integrity_check: string }[]>('PRAGMA integrity_check');
    if (check?.integrity_check !== 'ok') throw new Error(`The backup's database failed its integrity check: ${check?.integrity_check}`);
    const { rows } = await facts(orm);
    for (const [t, n] of Object.entries(manifest.rows)) {
      if (rows[t] !== n) throw new Error(`The backup's ${t} table has ${rows[t]} rows; its manifest says ${n}.`);
    }
  } catch (e) {
    await orm.close(true);
    fs.rmSync(staging, { force: true });
    throw e;
  }
  await orm.close(true);
  for (const suffix of ['-wal', '-shm']) fs.rmSync(`${databasePath}${suffix}`, { force: true });
  fs.renameSync(staging, databasePath);
  if (manifest.uploads) {
    const uploads = path.join(path.dirname(databasePath), 'uploads');
    fs.rmSync(uploads, { recursive: true, force: true });
    fs.cpSync(path.join(backupDir, 'uploads'), uploads, { recursive: true });
  }
  return manifest;
}
