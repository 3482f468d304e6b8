/**
 * The offline half of the web build (scripts/offline-build.ts) and how the server hands its files
 * out: the manifest and its icons, the manifest link in the page, a versioned precache in sw.js,
 * and headers that let a deploy reach a phone (sw.js and the manifest never cached as fresh).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import appJson from '../../app.json';
import { buildOffline, MANIFEST_FILE, webManifest, withHeadLinks } from '../../scripts/offline-build';
import { startHarness, type Harness } from './harness';

const ICONS = path.resolve(__dirname, '../../public/icons');

/** A PNG's width and height from its IHDR chunk (bytes 16–23, big-endian; PNG specification §11.2.2). */
function pngSize(file: string): { width: number; height: number } {
  const b = fs.readFileSync(file);
  expect(b.subarray(1, 4).toString('latin1')).toBe('PNG');
  return { width: b.readUInt32BE(16), height: b.readUInt32BE(20) };
}

/** A small stand-in for expo export's output: the page, a hashed bundle, our icons. */
function fakeDist(indexBody: string): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-dist-'));
  fs.writeFileSync(
    path.join(dir, 'index.html'),
    `<!DOCTYPE html><html><head><title>Sightfan</title></head><body>${indexBody}</body></html>`,
  );
  fs.mkdirSync(path.join(dir, '_expo/static/js/web'), { recursive: true });
  fs.writeFileSync(path.join(dir, '_expo/static/js/web/entry-0123456789abcdef0123456789abcdef.js'), 'console.log("app");');
  fs.cpSync(ICONS, path.join(dir, 'icons'), { recursive: true });
  return dir;
}

/** The precache list sw.js carries: each entry's url and revision (null: the url is the version). */
function precacheOf(dist: string): Map<string, string | null> {
  const sw = fs.readFileSync(path.join(dist, 'sw.js'), 'utf8');
  const entries = [...sw.matchAll(/url:"([^"]+)",revision:(null|"[0-9a-f]+")/g)];
  return new Map(entries.map(([, url, rev]) => [url, rev === 'null' ? null : rev.slice(1, -1)]));
}

describe('the web manifest', () => {
  it('offers 192 and 512 px icons both for any use and maskable, and each file is a PNG of the size it claims', () => {
    const icons = webManifest().icons;
    for (const purpose of ['any', 'maskable']) {
      expect(
        icons
          .filter((i) => i.purpose === purpose)
          .map((i) => i.sizes)
          .sort(),
      ).toEqual(['192x192', '512x512']);
    }
    for (const icon of icons) {
      const [w, h] = icon.sizes.split('x').map(Number);
      expect(pngSize(path.join(ICONS, path.basename(icon.src)))).toEqual({ width: w, height: h });
    }
  });

  it('uses the same theme colour as the page’s theme-color meta tag (app.json’s web theme colour)', () => {
    expect(webManifest().theme_color.toLowerCase()).toBe(appJson.expo.web.themeColor.toLowerCase());
  });

  it('is linked from the page’s head exactly once, however often the build step runs', () => {
    const once = withHeadLinks('<html><head><title>x</title></head><body></body></html>');
    const twice = withHeadLinks(once);
    expect(twice).toBe(once);
    expect(twice.match(/rel="manifest"/g)).toHaveLength(1);
    expect(twice.indexOf(`href="/${MANIFEST_FILE}"`)).toBeLessThan(twice.indexOf('</head>'));
  });
});

describe('the service worker’s precache', () => {
  const dirs: string[] = [];
  afterAll(() => {
    for (const d of dirs) fs.rmSync(d, { recursive: true, force: true });
  });

  it('holds the page, the bundle, the manifest and the icons, and nothing under /api', async () => {
    const dist = fakeDist('one');
    dirs.push(dist);
    await buildOffline(dist);
    const urls = [...precacheOf(dist).keys()];
    expect(urls).toEqual(
      expect.arrayContaining([
        'index.html',
        '_expo/static/js/web/entry-0123456789abcdef0123456789abcdef.js',
        MANIFEST_FILE,
        'icons/icon-192.png',
        'icons/maskable-512.png',
      ]),
    );
    expect(urls.some((u) => u.startsWith('api/'))).toBe(false);
    expect(urls).not.toContain('sw.js');
  });

  it('gives the page a new revision when a new build changes it, while a hashed bundle is versioned by its name alone', async () => {
    const before = fakeDist('build one');
    const after = fakeDist('build two');
    dirs.push(before, after);
    await buildOffline(before);
    await buildOffline(after);
    const a = precacheOf(before);
    const b = precacheOf(after);
    expect(a.get('index.html')).toMatch(/^[0-9a-f]{32}$/);
    expect(b.get('index.html')).not.toBe(a.get('index.html'));
    expect(a.get('icons/icon-192.png')).toBe(b.get('icons/icon-192.png'));
    expect(a.get('_expo/static/js/web/entry-0123456789abcdef0123456789abcdef.js')).toBeNull();
  });
});

describe('serving the offline files', () => {
  let h: Harness;
  let dist: string;
  beforeAll(async () => {
    h = await startHarness();
    dist = fakeDist('served');
    await buildOffline(dist);
    h.config.distDir = dist;
    await h.restart();
  });
  afterAll(async () => {
    await h.close();
    fs.rmSync(dist, { recursive: true, force: true });
  });

  it('serves sw.js from the site root as JavaScript that the browser must check again on every load', async () => {
    const res = await request(h.app).get('/sw.js');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^(text|application)\/javascript/);
    expect(res.headers['cache-control']).toBe('no-cache');
  });

  it('serves the manifest as a web manifest, and /manifest.json as JSON rather than the page', async () => {
    const manifest = await request(h.app).get(`/${MANIFEST_FILE}`);
    expect(manifest.status).toBe(200);
    expect(manifest.headers['content-type']).toMatch(/^application\/manifest\+json/);
    const json = await request(h.app).get('/manifest.json');
    expect(json.headers['content-type']).toMatch(/^application\/json/);
    expect(JSON.parse(json.text).name).toBe('Sightfan');
  });

  it('serves the icons as PNG images', async () => {
    const res = await request(h.app).get('/icons/icon-512.png');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/png');
  });

  it('still answers an app route with the page, which carries the manifest link', async () => {
    const res = await request(h.app).get('/quick').set('Accept', 'text/html');
    expect(res.status).toBe(200);
    expect(res.text).toContain(`<link rel="manifest" href="/${MANIFEST_FILE}">`);
  });
});
