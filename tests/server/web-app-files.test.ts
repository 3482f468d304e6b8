/**
 * How the server hands out the built web app (server/app.ts `serveWebApp`) over a small build made
 * here and finished by the real last build step (scripts/web-finish.ts): compressed copies where
 * the browser accepts them, caching by kind of file, and the HTML page only for page navigations.
 */
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { createApp, type SightfanApp } from '../../server/app';
import { createLogger } from '../../server/logger';
import { compressHashedFiles, withChunkPreloads, withFontPreload, withSessionPreload, withSplash } from '../../scripts/web-finish';
import { startHarness, type Harness } from './harness';

const SCRIPT = '/_expo/static/js/web/entry-0123abcd.js';
const FONT = '/assets/assets/fonts/Barlow-Regular.0123abcd.ttf';
const INDEX = '<!DOCTYPE html><html><head><title>Sightfan</title></head><body><div id="root"></div></body></html>';
// Compressible like a real bundle: the same kind of text many times over.
const SCRIPT_TEXT = Array.from({ length: 400 }, (_, i) => `__d(function(g,r,i,a,m,e,d){e.value${i}=r(d[0]).thing(${i});},${i});`).join(
  '\n',
);

let h: Harness;
let built: SightfanApp;
let server: http.Server;
let base: string;
let dist: string;

beforeAll(async () => {
  dist = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-dist-'));
  const put = (p: string, body: string | Buffer) => {
    fs.mkdirSync(path.dirname(path.join(dist, p)), { recursive: true });
    fs.writeFileSync(path.join(dist, p), body);
  };
  put('index.html', INDEX);
  put(SCRIPT, SCRIPT_TEXT);
  put(FONT, fs.readFileSync(path.resolve(__dirname, '../../assets/fonts/Barlow-Regular.ttf')));
  put('favicon.ico', fs.readFileSync(path.resolve(__dirname, '../../public/favicon.ico')));
  compressHashedFiles(dist);
  h = await startHarness();
  built = createApp({
    config: { ...h.config, distDir: dist },
    orm: h.orm,
    mailer: h.mailer,
    log: createLogger(true),
    sessionSecret: 'test-secret-that-is-long-enough-for-the-config-check',
  });
  server = http.createServer(built.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  built.close();
  await h.close();
  fs.rmSync(dist, { recursive: true, force: true });
});

interface Raw {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: Buffer;
}

/** A GET whose body comes back exactly as sent (no client decompression). */
function get(urlPath: string, headers: Record<string, string> = {}): Promise<Raw> {
  return new Promise((resolve, reject) => {
    http
      .get(`${base}${urlPath}`, { headers }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      })
      .on('error', reject);
  });
}

const NAVIGATION = { accept: 'text/html,application/xhtml+xml,application/xml;q=0.9,*/*;q=0.8' };

describe('the built app’s files', () => {
  it('sends a hashed script brotli-compressed to a browser that accepts brotli, saying it varies by encoding and never changes', async () => {
    const res = await get(SCRIPT, { 'accept-encoding': 'gzip, deflate, br' });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers.vary).toMatch(/Accept-Encoding/i);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.body.length).toBeLessThan(SCRIPT_TEXT.length / 4);
    expect(zlib.brotliDecompressSync(res.body).toString()).toBe(SCRIPT_TEXT);
  });

  it('sends gzip to a browser that accepts only gzip, and the file as it is to one that accepts neither', async () => {
    const gz = await get(SCRIPT, { 'accept-encoding': 'gzip' });
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(zlib.gunzipSync(gz.body).toString()).toBe(SCRIPT_TEXT);
    const plain = await get(SCRIPT, { 'accept-encoding': 'identity' });
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.headers.vary).toMatch(/Accept-Encoding/i);
    expect(plain.body.toString()).toBe(SCRIPT_TEXT);
  });

  it('sends a font compressed and cached for a year, with the font type', async () => {
    const res = await get(FONT, { 'accept-encoding': 'br' });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('font/ttf');
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['cache-control']).toContain('immutable');
  });

  it('answers a page navigation anywhere in the app with the page, revalidated every time', async () => {
    for (const p of ['/', '/projects/12', '/quick', '/sign-in']) {
      const res = await get(p, NAVIGATION);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toMatch(/text\/html/);
      expect(res.headers['cache-control']).toBe('no-cache');
      expect(res.body.toString()).toBe(INDEX);
    }
  });

  it('serves a real icon at /favicon.ico, not the page', async () => {
    const res = await get('/favicon.ico', { accept: 'image/avif,image/webp,image/apng,image/*,*/*;q=0.8' });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/icon/);
    // An ICO file starts with reserved 0 and type 1 (icon).
    expect([...res.body.subarray(0, 4)]).toEqual([0, 0, 1, 0]);
  });

  it('answers a file the build does not have with 404, never the page, whatever the request accepts', async () => {
    for (const [p, accept] of [
      ['/manifest.json', 'application/manifest+json,*/*'],
      ['/foo.png', 'image/*,*/*;q=0.8'],
      ['/_expo/static/js/web/entry-gone.js', '*/*'],
      ['/icons/icon-192.png', NAVIGATION.accept],
    ]) {
      const res = await get(p, { accept });
      expect({ path: p, status: res.status }).toEqual({ path: p, status: 404 });
      expect(res.headers['content-type']).not.toMatch(/text\/html/);
      expect(res.body.toString()).not.toContain('<div id="root">');
    }
  });

  it('answers a request for an app path that does not ask for HTML (a script’s fetch) with 404', async () => {
    const res = await get('/projects/12', { accept: 'application/json' });
    expect(res.status).toBe(404);
  });
});

describe('the last build step’s page edits', () => {
  it('adds the font, chunk and session preloads and the splash once, however often it runs', () => {
    const finish = (html: string) =>
      withSplash(withSessionPreload(withChunkPreloads(withFontPreload(html, FONT), ['/_expo/static/js/web/sign-in-1.js'])));
    const once = finish(INDEX);
    expect(finish(once)).toBe(once);
    expect(once.match(/rel="preload"/g)).toHaveLength(3);
    // The session is asked for with cookies, as the app's API client asks (credentials: 'include').
    expect(once).toContain('<link rel="preload" href="/api/auth/session" as="fetch" crossorigin="use-credentials">');
    expect(once).toContain(`<link rel="preload" href="${FONT}" as="font" type="font/ttf" crossorigin>`);
    // The splash is inside the root, which React replaces with the first screen.
    expect(once).toMatch(/<div id="root"><div class="sf-splash"[^>]*>.*Opening Sightfan….*<\/div><\/div>/);
  });
});
