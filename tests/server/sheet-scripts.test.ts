/**
 * Every script the app accepts prints on the sheet, and what cannot print is refused when saved.
 * Read back with poppler (pdftotext, pdffonts); page 1 is also rendered to a PNG in
 * tests/e2e/artifacts/sheet-scripts/ for a person to look at (Arabic joining, Hebrew order).
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createProjectBody, type CatalogueItemDto } from '../../shared/schemas';
import { isPrintable } from '../../shared/text/printable';
import { fontFace, SHEET_FONTS, type SheetFont } from '../../server/pdf/fonts';
import { facesFor } from '../../server/pdf/text-runs';
import { EMAIL, startHarness, type Harness } from './harness';
import { binary, popplerOn, type PopplerTool } from './pdf-tools';

type Agent = ReturnType<typeof request.agent>;
let h: Harness;
let installer: Agent;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-scripts-'));
const ARTIFACTS = path.resolve(__dirname, '..', 'e2e', 'artifacts', 'sheet-scripts');

beforeAll(async () => {
  h = await startHarness();
  installer = await h.signedIn(EMAIL.installer);
});
afterAll(async () => {
  await h.close();
  fs.rmSync(tmp, { recursive: true, force: true });
});

const tool = (cmd: PopplerTool, pdf: Buffer) => popplerOn(cmd, pdf, tmp);

describe('characters the sheet can print', () => {
  it('has a real glyph (not .notdef) in the face it is set in, for every character the schemas accept, in every sheet face', () => {
    let checked = 0;
    const missing: string[] = [];
    for (let cp = 0; cp <= 0x3ffff; cp++) {
      if (!isPrintable(cp)) continue;
      const ch = String.fromCodePoint(cp);
      for (const face of Object.keys(SHEET_FONTS) as SheetFont[]) {
        const [{ font }] = facesFor(face, ch);
        // Glyph 0 is .notdef, the missing-character box (OpenType specification, "Recommendations for OpenType fonts": glyph index 0).
        if (!font || fontFace(font).glyphForCodePoint(cp).id === 0) missing.push(`U+${cp.toString(16)} in ${face}`);
      }
      checked++;
    }
    // The scripts the issue names, at least: a few thousand CJK characters alone.
    expect(checked).toBeGreaterThan(20000);
    expect(missing.slice(0, 10)).toEqual([]);
  });

  it.each([
    ['Hebrew', 'מחסן קירור'],
    ['Arabic', 'مستودع التبريد'],
    ['Chinese', '冷库物流'],
    ['Japanese', '東京倉庫 ひがし棟 カート'],
    ['Greek and Cyrillic', 'Αποθήκη Склад'],
    ['accented Latin', 'Łódź Ærøskøbing Çağlayan'],
  ])('accepts a %s project name', (_script, name) => {
    expect(createProjectBody.safeParse({ name }).success).toBe(true);
  });

  it.each([
    ['an emoji', 'Dock 🚚 north', /Emoji cannot be printed/],
    ['a flag', 'Depot 🇩🇪', /cannot be printed|cannot print/],
    ['Korean, which no shipped face has', '창고 A', /cannot print "창"/],
    ['a private-use character', 'Bay \ue000', /cannot print U\+E000|cannot print "\ue000"/],
  ])('refuses a name with %s with a sentence', (_what, name, message) => {
    const r = createProjectBody.safeParse({ name });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].message).toMatch(message);
  });

  it('refuses an emoji in a zone name at the API with 400 and a sentence for the field', async () => {
    const scene = {
      zones: [
        {
          id: 'z1',
          name: 'Forklift lane 🚜',
          polygonM: [
            [0, 0],
            [4, 0],
            [4, 3],
          ],
        },
      ],
    };
    const res = await installer.post('/api/projects').send({ name: 'Emoji zone (demo)', scene });
    expect(res.status).toBe(400);
    expect(res.body.fields['scene.zones.0.name']).toMatch(/Emoji cannot be printed/);
  });
});

describe('a sheet with names in several scripts', () => {
  let pdf: Buffer;
  const names = {
    project: 'מחסן קירור צפון (demo)',
    customer: '冷库物流有限公司 (demo)',
    site: '東京倉庫 ひがし棟 (demo)',
    mirror: 'مرآة المدخل',
    note: 'שורה ראשונה ליד הדלת\nשורה שנייה: 2 מראות',
  };

  beforeAll(async () => {
    const created = await installer.post('/api/projects').send({
      name: names.project,
      customer: names.customer,
      site: names.site,
      scene: { viewers: [{ id: 'v1', name: 'נהג', positionM: [0, 0], eyeHeightM: 2.2 }] },
    });
    expect(created.status).toBe(201);
    const id = created.body.project.id as number;
    const catalogueItemId = ((await installer.get('/api/catalogue')).body.items as CatalogueItemDto[])[0].id;
    const placed = await installer.post(`/api/projects/${id}/placements`).send({
      label: names.mirror,
      catalogueItemId,
      positionM: [3, 4],
      heightM: 2.6,
      azimuthRad: -2.2,
      tiltDownRad: 0.35,
      viewerId: 'v1',
      notes: names.note,
    });
    expect(placed.status).toBe(201);
    const issued = await installer.post(`/api/projects/${id}/sheet/revisions`);
    expect(issued.status).toBe(201);
    const res = await installer.get(`/api/projects/${id}/sheet.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    pdf = res.body as Buffer;
    fs.mkdirSync(ARTIFACTS, { recursive: true });
    fs.writeFileSync(path.join(ARTIFACTS, 'scripts-sheet.pdf'), pdf);
    execFileSync('/usr/bin/pdftoppm', [
      '-png',
      '-r',
      '110',
      '-f',
      '1',
      '-l',
      '1',
      path.join(ARTIFACTS, 'scripts-sheet.pdf'),
      path.join(ARTIFACTS, 'page'),
    ]);
  });

  it('embeds the Hebrew, Arabic and CJK fallback faces as subsets, beside Barlow', () => {
    const rows = tool('pdffonts', pdf).trim().split('\n').slice(2);
    const families = rows.map((r) => /^[A-Z]{6}\+([\w-]+)/.exec(r)?.[1]);
    for (const face of ['NotoSansHebrew', 'NotoSansArabic', 'NotoSansJP', 'NotoSansSC'])
      expect(families.some((f) => f?.startsWith(face))).toBe(true);
    for (const row of rows) expect(row.trim().split(/\s+/).slice(-5, -2)).toEqual(['yes', 'yes', 'yes']);
  });

  it('reads back every name in its own script and order (poppler rebuilds logical order from the glyph positions)', () => {
    const text = tool('pdftotext', pdf).replace(/[\u202a-\u202e]/g, '');
    expect(text).toContain('冷库物流有限公司');
    expect(text).toContain('東京倉庫 ひがし棟');
    // Drawn in the wrong direction, these would read back letter-reversed.
    expect(text).toContain('מחסן קירור צפון');
    expect(text).toContain('مرآة المدخل');
    expect(text).not.toContain('ןופצ רורק ןסחמ');
  });

  it("keeps the line break of a right-to-left note and prints no stand-in '?' for it", () => {
    const text = tool('pdftotext', pdf).replace(/[\u202a-\u202e]/g, '');
    const lines = text.split('\n');
    const first = lines.findIndex((l) => l.includes('שורה ראשונה ליד הדלת'));
    const second = lines.findIndex((l) => l.includes('שורה שנייה'));
    expect(first).toBeGreaterThanOrEqual(0);
    expect(second).toBeGreaterThan(first);
    expect(lines[first]).not.toContain('?');
  });

  it('stays within the sheet size budget of 500 KB with the CJK subsets embedded', () => {
    expect(pdf.length).toBeLessThan(500 * 1024);
  });
});
