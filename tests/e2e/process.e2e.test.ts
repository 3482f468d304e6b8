import { spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

const root = path.resolve(__dirname, '../..');

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

describe('the server process that npm start runs', () => {
  it('migrates, seeds, starts fake mail, serves the app and /api, and stops cleanly on SIGTERM', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-proc-'));
    const port = await freePort();
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      cwd: root,
      env: {
        ...process.env,
        NODE_ENV: 'development',
        PORT: String(port),
        HOST: '127.0.0.1',
        FAKE_SMTP_PORT: '0',
        DATABASE_PATH: path.join(dir, 'p.sqlite'),
      },
    });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (out += d));
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    try {
      const until = Date.now() + 60_000;
      while (!out.includes('Sightfan is serving') && Date.now() < until) await new Promise((r) => setTimeout(r, 100));
      expect(out).toMatch(/database ready: SQLite at .*p\.sqlite \(migrations applied\)/);
      expect(out).toMatch(/demo data seeded/);
      expect(out).toMatch(/fake mail server listening on 127\.0\.0\.1:\d+/);

      // Asked as a browser navigates (only navigations get the page; other requests for unknown files are 404).
      const page = await fetch(`http://127.0.0.1:${port}/sign-in`, { headers: { accept: 'text/html' } });
      expect(page.status).toBe(200);
      expect(await page.text()).toMatch(/<div id="root">/);
      const health = await fetch(`http://127.0.0.1:${port}/api/health`);
      expect(await health.json()).toEqual({ ok: true });
      // The demo secret is generated once and kept beside the database.
      expect(fs.statSync(path.join(dir, 'session-secret')).mode & 0o777).toBe(0o600);

      child.kill('SIGTERM');
      expect(await exited).toBe(0);
      expect(out).toMatch(/SIGTERM received, shutting down/);
      expect(out).toMatch(/stopped cleanly/);
    } finally {
      if (child.exitCode === null) child.kill('SIGKILL');
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('the web bundle', () => {
  it('carries no server-only package', () => {
    const jsDir = path.join(root, 'dist', '_expo', 'static', 'js', 'web');
    const bundle = fs
      .readdirSync(jsDir)
      .filter((f) => f.endsWith('.js'))
      .map((f) => fs.readFileSync(path.join(jsDir, f), 'utf8'))
      .join('\n');
    expect(bundle.length).toBeGreaterThan(100_000);
    for (const marker of [
      '@mikro-orm',
      'nodemailer',
      'bcryptjs',
      'smtp-server',
      'express-session',
      'node_sqlite3',
      'pdfkit',
      '@aws-sdk/client-s3',
      '@img/sharp',
    ]) {
      expect({ marker, found: bundle.includes(marker) }).toEqual({ marker, found: false });
    }
  });
});
