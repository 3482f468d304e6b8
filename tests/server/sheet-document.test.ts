/**
 * The sheet as a document (server/pdf): tagged with a language and structure, text that extracts in
 * reading order and can be searched, no page left almost empty, and a plan page an installer can set
 * the mirrors out from. The PDFs are the demo project's (scripts/sample-sheets.ts) rendered without a
 * server, read back with poppler (pdfinfo, pdftotext) as a reader's tools would.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { SAFETY_CAUTIONS } from '../../shared/cautions';
import { multiPolygonArea, polygonArea } from '../../shared/geometry/polygon';
import type { SheetPaper, UnitSystem } from '../../shared/schemas';
import { addressLines, renderSheet } from '../../server/pdf/render-sheet';
import { buildSheetContent, contentHash, type SheetContent } from '../../server/pdf/sheet-model';
import type { SheetApproval } from '../../server/pdf/approval-mark';
import { demoSheetInput } from '../../scripts/sample-sheets';
import { flat, pageCount, poppler } from './pdf-tools';

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-sheet-doc-'));
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

interface Rendered {
  file: string;
  content: SheetContent;
  pages: number;
  raw: string;
}
const rendered = new Map<string, Rendered>();

async function sheet(units: UnitSystem, paper: SheetPaper): Promise<Rendered> {
  const key = `${units}-${paper}`;
  const known = rendered.get(key);
  if (known) return known;
  const { content } = buildSheetContent(demoSheetInput(units));
  const pdf = await renderSheet(
    content,
    { number: 1, contentHash: contentHash(content), issuedAt: new Date(Date.UTC(2026, 11, 2)) },
    paper,
  );
  const file = path.join(tmp, `${key}.pdf`);
  fs.writeFileSync(file, pdf);
  const pages = pageCount(file);
  const out = { file, content, pages, raw: pdf.toString('latin1') };
  rendered.set(key, out);
  return out;
}

/** Text of one page (or all) as pdftotext gives it without -layout: the reading order a reader's tools use. */
const textOf = (file: string, page?: number) => poppler('pdftotext', file, page ? ['-f', String(page), '-l', String(page)] : []);
const pageWith = (s: Rendered, needle: string) => {
  for (let p = 1; p <= s.pages; p++) if (textOf(s.file, p).includes(needle)) return p;
  throw new Error(`no page holds "${needle}"`);
};

const SHEETS: [UnitSystem, SheetPaper][] = [
  ['metric', 'a4'],
  ['metric', 'letter'],
  ['imperial', 'a4'],
  ['imperial', 'letter'],
];

describe('the sheet as an accessible document', () => {
  it('is tagged, says its language, and shows its title in a viewer', async () => {
    const s = await sheet('metric', 'a4');
    const info = poppler('pdfinfo', s.file);
    expect(info).toMatch(/Tagged:\s+yes/);
    expect(info).toMatch(/Title:\s+Specification sheet — Cold store aisles and dock \(demo\) — revision 1/);
    expect(s.raw).toContain('/Lang (en)');
    expect(s.raw).toMatch(/\/DisplayDocTitle true/);
  });

  it('gives the title, the headings, the paragraphs and the tables their structure', async () => {
    const s = await sheet('metric', 'a4');
    const tree = poppler('pdfinfo', s.file, ['-struct-text']);
    expect(tree).toMatch(/H1 \(block\)\n\s+"Cold store aisles and dock \(demo\)"/);
    expect(tree).toMatch(/H2 \(block\)\n\s+"Zones that must be seen"/);
    expect(tree).toMatch(/H2 \(block\)\n\s+"Plan: what each mirror shows on the floor"/);
    expect(tree).toMatch(/TH:\n\s+\/Scope \/Column\n\s+"Zone"/);
    expect(tree).toMatch(/TD\n\s+"T-junction cross traffic"/);
    expect(tree).toMatch(/P \(block\)\n\s+"This sheet states what the mirrors show/);
    // The cautions are a numbered list.
    expect(tree).toMatch(/LI \(block\)\n\s+Lbl \(block\)\n\s+"1"\n\s+LBody \(block\)\n\s+"Objects in a convex mirror/);
    // The page footer is pagination, not content.
    expect(tree).not.toContain('Page 1 of');
  });
});

describe('text a reader can search and copy', () => {
  it.each(SHEETS)('reads each mirror page in %s on %s label by value, block by block, never across blocks', async (units, paper) => {
    const s = await sheet(units, paper);
    s.content.placements.forEach((p, i) => {
      const page = pageWith(s, `MIRROR ${i + 1} OF ${s.content.placements.length}`);
      const text = flat(textOf(s.file, page));
      // Where it goes, then the mirror: each label directly followed by its value.
      const expected = [...p.mounting, ...p.mirror].map(([label, value]) => `${label} ${value}`);
      let from = 0;
      for (const pair of expected) {
        const at = text.indexOf(pair, from);
        expect({ pair, found: at >= 0 }).toEqual({ pair, found: true });
        from = at + pair.length;
      }
    });
  });

  it('extracts the letter-spaced header as words, so "specification" can be found', async () => {
    const s = await sheet('metric', 'a4');
    expect(flat(textOf(s.file, 1))).toContain('SIGHTFAN · MIRROR SPECIFICATION SHEET');
    expect(flat(textOf(s.file, pageWith(s, 'MIRROR 1 OF')))).toContain('MIRROR 1 OF 2 M1 junction WHERE IT GOES');
  });

  it.each(SHEETS)('prints the installer\u2019s e-mail address whole, hyphen included (%s, %s)', async (units, paper) => {
    const s = await sheet(units, paper);
    expect(s.content.installer.email).toContain('-');
    expect(flat(textOf(s.file, 1))).toContain(s.content.installer.email);
  });
});

describe('addressLines', () => {
  // A monospaced measure: every character 5 pt wide.
  const measure = (t: string) => t.length * 5;

  it('keeps an address that fits on one line', () => {
    expect(addressLines('ines.installer@sightfan-demo.example', 400, measure)).toEqual(['ines.installer@sightfan-demo.example']);
  });

  it('breaks a long address only before "@" or a dot, never at its hyphen', () => {
    expect(addressLines('ines.installer@sightfan-demo.example', 100, measure)).toEqual(['ines.installer', '@sightfan-demo', '.example']);
  });
});

describe('pages that carry their weight', () => {
  /** For each page, how far down its body text reaches, as a share of the page's writable height (footer excluded). */
  function fill(file: string): number[] {
    const html = poppler('pdftotext', file, ['-bbox']);
    return html
      .split('<page ')
      .slice(1)
      .map((page) => {
        const height = Number(/height="([\d.]+)"/.exec(page)?.[1]);
        const bottoms = [...page.matchAll(/<word [^>]*yMax="([\d.]+)"/g)].map((m) => Number(m[1])).filter((y) => y < height - 54);
        // Margins of the sheet: 44 pt top, 54 pt bottom (render-sheet.ts).
        return (Math.max(...bottoms) - 44) / (height - 44 - 54);
      });
  }

  it.each(SHEETS)('leaves no page less than a quarter used (%s, %s)', async (units, paper) => {
    const s = await sheet(units, paper);
    const used = fill(s.file);
    expect(used).toHaveLength(s.pages);
    for (const [i, share] of used.entries())
      expect({ page: i + 1, atLeastAQuarter: share >= 0.25 }).toEqual({ page: i + 1, atLeastAQuarter: true });
  });

  it('keeps the approval block with the purchase lines on US Letter', async () => {
    const s = await sheet('imperial', 'letter');
    expect(pageWith(s, 'Approval by the safety officer')).toBe(pageWith(s, 'Purchase lines'));
  });
});

describe('the plan page', () => {
  it('marks the origin and sets each mirror out from named walls, in the plan page and the mirror pages', async () => {
    const s = await sheet('metric', 'a4');
    const page = flat(textOf(s.file, pageWith(s, 'Plan: what each mirror shows')));
    expect(page).toContain('Origin 0, 0');
    expect(page).toContain('Setting out: where each mirror goes');
    // M1 hangs on the column's north face (y = 10 m) 0.22 m in front of it (M1_Y = 10 + 0.305·sin 45° = 10.216 m,
    // demo-project.ts) and sits 19.75 m east of the hall's west wall (x = 0).
    expect(page).toContain('M1 junction 0.22 m from wall W7 (north face) 19.75 m from wall W4 (east face) 2.90 m');
    // The walls measured from are named on the drawing.
    for (const name of ['W4', 'W7']) expect(page).toMatch(new RegExp(`\\b${name}\\b`));
  });

  it('carries the four cautions and a legend of what its colours and hatching mean', async () => {
    const s = await sheet('metric', 'a4');
    const page = flat(textOf(s.file, pageWith(s, 'Plan: what each mirror shows')));
    for (const c of SAFETY_CAUTIONS) expect(page).toContain(flat(c.text));
    expect(page).toContain('Part of a zone no mirror shows (gap)');
    expect(page).toContain('Zone covered: 95 % or more seen');
    expect(page).toContain('Zone partly covered: 60–94 % seen');
    expect(page).toContain('Zone with a large gap: under 60 % seen');
  });

  it('hatches exactly what the engine leaves unseen of each zone', async () => {
    const { content, evaluation } = buildSheetContent(demoSheetInput('metric'));
    const scene = demoSheetInput('metric').project.scene;
    content.plan.zones.forEach((z, i) => {
      // Zone area − gap area = the area the engine counts as seen (its own coveredM2), to 1 cm² per m².
      const zoneArea = polygonArea([scene.zones[i].polygonM]);
      expect(zoneArea - multiPolygonArea(z.gap ?? [])).toBeCloseTo(evaluation.zones[i].coveredM2, 2);
      // The demo's zones print 74 % and 77 % seen: both in the 60–94 % band, outlined as partly covered.
      expect(z.band).toBe('partial');
    });
  });
});

describe('plausibility sentences on the sheet', () => {
  it('says, before the numbers of a mirror, that it hangs above the top of the wall behind it', async () => {
    const input = demoSheetInput('metric');
    // A wall-hung panel (a full dome hangs from the ceiling and is never said to be above a wall).
    const hung = input.placements.find((p) => input.catalogue.find((c) => c.id === p.catalogueItemId)?.mirror.shape !== 'dome')!;
    // Moved clear of the building (its walls reach higher than any mirror), onto a low partition of its own.
    const target = { ...hung, positionM: [300, 300] as [number, number] };
    input.placements = input.placements.map((p) => (p.id === target.id ? target : p));
    const back: [number, number] = [
      target.positionM[0] - 0.1 * Math.cos(target.azimuthRad),
      target.positionM[1] - 0.1 * Math.sin(target.azimuthRad),
    ];
    const across: [number, number] = [-Math.sin(target.azimuthRad), Math.cos(target.azimuthRad)];
    const lowWall = {
      id: 'low-partition',
      kind: 'wall' as const,
      aM: [back[0] - across[0], back[1] - across[1]] as [number, number],
      bM: [back[0] + across[0], back[1] + across[1]] as [number, number],
      heightM: target.heightM / 2,
    };
    const plain = buildSheetContent(demoSheetInput('metric')).content;
    expect(plain.placements.every((p) => p.plausibility === undefined)).toBe(true);
    const scene = { ...input.project.scene, walls: [...input.project.scene.walls, lowWall] };
    const { content } = buildSheetContent({ ...input, project: { ...input.project, scene } });
    const mine = content.placements.find((p) => p.label === target.label)!;
    expect(mine.plausibility?.[0]).toMatch(new RegExp(`^“${target.label}” is mounted at .* above the top of wall W\\d+, which is`));
    const pdf = await renderSheet(
      content,
      { number: 1, contentHash: contentHash(content), issuedAt: new Date(Date.UTC(2026, 11, 2)) },
      'a4',
    );
    const file = path.join(tmp, 'plausibility.pdf');
    fs.writeFileSync(file, pdf);
    expect(flat(textOf(file))).toContain(`Check: “${target.label}” is mounted at`);
  });
});

describe('the approval block in the document structure', () => {
  async function structureOf(approval: SheetApproval, name: string): Promise<string> {
    const { content } = buildSheetContent(demoSheetInput('metric'));
    const pdf = await renderSheet(
      content,
      { number: 2, contentHash: contentHash(content), issuedAt: new Date(Date.UTC(2026, 11, 2)) },
      'a4',
      approval,
    );
    const file = path.join(tmp, `${name}.pdf`);
    fs.writeFileSync(file, pdf);
    return poppler('pdfinfo', file, ['-struct-text']);
  }

  it('reads an approval as a heading, a paragraph and a table whose labels head their rows', async () => {
    const tree = await structureOf(
      {
        approved: true,
        reviewerName: 'Rhea Demo-Reviewer',
        reviewerRole: 'Safety officer',
        approvedAt: '2026-12-02T16:40:00.000Z',
        revision: 2,
        contentHash: 'a'.repeat(64),
      },
      'approved',
    );
    expect(tree).toMatch(/H2 \(block\)\n\s+"Approval by the safety officer"/);
    expect(tree).toMatch(/P \(block\)\n\s+"Approved: revision 2"/);
    expect(tree).toMatch(/TH:\n\s+\/Scope \/Row\n\s+"Approved by"\n\s+TD\n\s+"Rhea Demo-Reviewer"/);
    expect(tree).toMatch(/"Date and time"\n\s+TD\n\s+"2026-12-02 16:40 UTC"/);
    expect(tree).toMatch(/"Content hash"\n\s+TD\n\s+"a{64}"/);
    // Nothing of the block falls outside the structure after its box is drawn.
    expect(tree.indexOf('"Approved: revision 2"')).toBeGreaterThan(tree.indexOf('"Approval by the safety officer"'));
  });

  it('reads a sheet without approval as "Not approved", its reason and the blanks to fill in, once, not per page', async () => {
    const tree = await structureOf({ approved: false, reason: 'This job has not been approved by a reviewer.' }, 'not-approved');
    expect(tree).toMatch(/P \(block\)\n\s+"Not approved"\n\s+P \(block\)\n\s+"This job has not been approved by a reviewer\."/);
    for (const blank of ['Reviewer', 'Decision', 'Date', 'Signature']) expect(tree).toMatch(new RegExp(`P \\(block\\)\\n\\s+"${blank}"`));
    // The band on every page is a running mark (an artifact), so the structure holds the fact once.
    expect(tree).not.toContain('NOT APPROVED');
  });
});
