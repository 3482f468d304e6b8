/**
 * The specification sheet, end to end: a real SQLite file, real pdfkit output read back with
 * poppler (pdftotext, pdffonts, pdfinfo, pdftoppm), and the real fake SMTP server.
 * Check values are the engine's own numbers (evaluateProject), formatted with the sheet's formatters.
 */
import net from 'node:net';
import { formatCoveredShare } from '../../shared/zone-verdict';
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { simpleParser } from 'mailparser';
import { evaluateProject } from '../../shared/project-optics';
import type { CatalogueItemDto, ProjectDto, SheetStatusDto } from '../../shared/schemas';
import { resolveUnits } from '../../shared/units';
import { createApp } from '../../server/app';
import { createLogger } from '../../server/logger';
import { createMailer } from '../../server/modules/mail/mailer';
import { OutgoingMail } from '../../server/modules/mail/outgoing-mail.entity';
import { SAFETY_CAUTIONS } from '../../shared/cautions';
import { LABEL_LINE_PT, OUTLINE_TOLERANCE_PT, labelSpot } from '../../server/pdf/draw-plan';
import { simplifyRing } from '../../shared/geometry/simplify';
import { sheetFormat } from '../../server/pdf/sheet-model';
import { EMAIL, startHarness, type Harness } from './harness';
import { binary, flat, issueSheet, pageCount, pdfFile, popplerOn, type PopplerTool } from './pdf-tools';

type Agent = ReturnType<typeof request.agent>;
let h: Harness;
let installer: Agent;
let projectId: number;
const OTHER_INSTALLER = 'otto.other@sightfan-demo.example';
const ARTIFACTS = path.resolve(__dirname, '..', 'e2e', 'artifacts', 'sheet');
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-sheet-'));

beforeAll(async () => {
  h = await startHarness();
  await h.addUser(OTHER_INSTALLER, 'installer');
  installer = await h.signedIn(EMAIL.installer);
  const list = await installer.get('/api/projects');
  projectId = list.body.projects[0].id;
});
afterAll(async () => {
  await h.close();
  fs.rmSync(tmp, { recursive: true, force: true });
});

/** What the app's Download does (pdf-tools.ts), for the demo project; `params` as "paper=letter". */
const fetchSheet = (agent: Agent, params = '') => issueSheet(agent, projectId, params);
const getPdf = (agent: Agent, query = '') => agent.get(`/api/projects/${projectId}/sheet.pdf${query}`).buffer(true).parse(binary);
const revisionCount = async () => ((await installer.get(`/api/projects/${projectId}/sheet`)).body as SheetStatusDto).revisions.length;

const tool = (cmd: PopplerTool, pdf: Buffer, args: string[] = []) => popplerOn(cmd, pdf, tmp, args);
const textOf = (pdf: Buffer) => flat(tool('pdftotext', pdf));
const pagesOf = (pdf: Buffer) => pageCount(pdfFile(pdf, tmp));

async function engine() {
  const project = (await installer.get(`/api/projects/${projectId}`)).body.project as ProjectDto;
  const catalogue = (await installer.get('/api/catalogue')).body.items as CatalogueItemDto[];
  const me = (await installer.get('/api/auth/me')).body.user as { units: 'metric' | 'imperial' };
  const evaluation = evaluateProject({ scene: project.scene, placements: project.placements, catalogue });
  return { project, catalogue, evaluation, f: sheetFormat(resolveUnits(project.units, me.units)) };
}

describe('the specification sheet PDF', () => {
  it("carries the engine's numbers for each placement, each zone's share and the purchase total", async () => {
    const { pdf, res } = await fetchSheet(installer);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = textOf(pdf);
    const { project, catalogue, evaluation, f } = await engine();
    expect(evaluation.placements.length).toBeGreaterThan(0);
    evaluation.placements.forEach((ev, i) => {
      const n = ev.numbers;
      if (!n) throw new Error(`demo placement ${project.placements[i].label} has no numbers: ${ev.problem?.message}`);
      const expected = [
        project.placements[i].label,
        f.size(n.radiusM),
        f.size(n.focalLengthM),
        `${f.angle(n.onAxisFieldOfView.horizontalRad)} × ${f.angle(n.onAxisFieldOfView.verticalRad)}`,
        f.dist(n.eyeDistanceM),
        f.angle(n.eyeOffAxisRad),
        f.range(n.rangesM.detect.adult),
        f.range(n.rangesM.recognise.adult),
        f.range(n.rangesM.detect.child),
        f.range(n.rangesM.recognise.child),
        ...(n.rimSqueeze > 0 ? [f.percent(n.rimSqueeze)] : []),
        ...n.references.flatMap((r) => [
          f.dist(r.objectDistanceM),
          f.magnification(r.magnification),
          f.dist(r.trueDistanceM),
          f.dist(r.sizeCueDistanceM),
          f.ratio(r.ratio),
        ]),
      ];
      for (const value of expected) expect(text).toContain(value);
    });
    project.scene.zones.forEach((z, i) => expect(text).toContain(`${z.name}: ${formatCoveredShare(evaluation.zones[i].fraction)} seen`));
    // Both criteria with their angles, each zone's own, and the on-axis figure named as such.
    expect(text).toContain("Detect: 6′ of the person's height; recognise: 20′ of the person's height");
    expect(text).toContain('T-junction cross traffic standing adult recognise');
    expect(text).toContain('Dock corner apron standing adult recognise');
    expect(text).toContain('Field of view on axis');
    const used = project.placements.map((p) => catalogue.find((c) => c.id === p.catalogueItemId)!);
    const totalMinor = used.reduce((sum, item) => sum + item.unitPriceMinor, 0);
    expect(text).toContain(`Total ${f.money(totalMinor, used[0].currency)}`);
  });

  it('states the four cautions, the limits of what it promises and an approval block that says the job is not approved', async () => {
    const text = textOf((await fetchSheet(installer)).pdf);
    // The four cautions the product always carries, by a phrase of each written here, not read
    // from the list the sheet prints: a caution dropped from that list fails this test.
    for (const phrase of [
      'smaller and farther away than they are',
      'replaces none of them',
      'which take precedence',
      'a person walking the zone',
    ]) {
      expect(text).toContain(phrase);
    }
    // The app's caution block and the sheet show the same sentences, whole.
    for (const caution of SAFETY_CAUTIONS) expect(text).toContain(caution.text);
    expect(text).toContain('Not approved');
    expect(text).toContain('NOT APPROVED — no safety officer has approved this job');
    expect(text).toContain('not a certificate of compliance');
    for (const field of ['Reviewer', 'Decision', 'Date', 'Signature']) expect(text).toContain(field);
  });

  it('embeds every font it uses, only the shipped families, as subsets', async () => {
    const rows = tool('pdffonts', (await fetchSheet(installer)).pdf)
      .trim()
      .split('\n')
      .slice(2);
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      expect(row).toMatch(/^[A-Z]{6}\+(Barlow|JetBrainsMono)-\w+\s/);
      const cols = row.trim().split(/\s+/);
      // name, type…, encoding, emb, sub, uni, object, id
      expect(cols.slice(-5, -2)).toEqual(['yes', 'yes', 'yes']);
    }
  });

  it('says "Page x of y" on every page and is rendered to PNGs for a person to look at', async () => {
    const { pdf } = await fetchSheet(installer);
    const pages = pagesOf(pdf);
    expect(pages).toBeGreaterThanOrEqual(3);
    const text = textOf(pdf);
    for (let i = 1; i <= pages; i++) expect(text).toContain(`Page ${i} of ${pages}`);
    fs.mkdirSync(ARTIFACTS, { recursive: true });
    for (const f of fs.readdirSync(ARTIFACTS)) if (f.endsWith('.png')) fs.rmSync(path.join(ARTIFACTS, f));
    fs.writeFileSync(path.join(ARTIFACTS, 'demo-sheet.pdf'), pdf);
    execFileSync('/usr/bin/pdftoppm', ['-png', '-r', '60', path.join(ARTIFACTS, 'demo-sheet.pdf'), path.join(ARTIFACTS, 'page')]);
    expect(fs.readdirSync(ARTIFACTS).filter((f) => f.endsWith('.png'))).toHaveLength(pages);
  });

  it('prints on US Letter when asked, and refuses an unknown paper with 400', async () => {
    const { pdf } = await fetchSheet(installer, 'paper=letter');
    expect(tool('pdfinfo', pdf)).toMatch(/Page size:\s+612 x 792 pts \(letter\)/);
    expect((await installer.get(`/api/projects/${projectId}/sheet.pdf?paper=a3`)).status).toBe(400);
  });

  it('gives byte-identical PDFs for unchanged content, named after the project and revision', async () => {
    const a = await fetchSheet(installer);
    const b = await fetchSheet(installer);
    expect(a.res.headers['x-sheet-revision']).toBe(b.res.headers['x-sheet-revision']);
    expect(Buffer.compare(a.pdf, b.pdf)).toBe(0);
    expect(a.res.headers['content-disposition']).toBe(
      `attachment; filename="sightfan-cold-store-aisles-and-dock-demo-rev${a.res.headers['x-sheet-revision']}-a4.pdf"`,
    );
  });

  it('raises the revision when the content changes, and keeps a record of each issued revision', async () => {
    const before = await fetchSheet(installer);
    const revBefore = Number(before.res.headers['x-sheet-revision']);
    const { project } = await engine();
    const p = project.placements[0];
    const patched = await installer
      .patch(`/api/projects/${projectId}/placements/${p.id}`)
      .send({ version: p.version, heightM: p.heightM + 0.2 });
    expect(patched.status).toBe(200);

    const status = (await installer.get(`/api/projects/${projectId}/sheet`)).body as SheetStatusDto;
    expect(status.current).toMatchObject({ number: revBefore + 1, changedSinceLast: true });

    const after = await fetchSheet(installer);
    expect(Number(after.res.headers['x-sheet-revision'])).toBe(revBefore + 1);
    expect(Buffer.compare(before.pdf, after.pdf)).not.toBe(0);

    const again = (await installer.get(`/api/projects/${projectId}/sheet`)).body as SheetStatusDto;
    expect(again.current.changedSinceLast).toBe(false);
    expect(again.revisions.map((r) => r.number)).toEqual([revBefore + 1, revBefore]);
    expect(again.revisions[0].contentHash).toBe(status.current.contentHash);
    expect(again.revisions[0].issuedBy).toContain('Ines Okafor');
    expect(new Set(again.revisions.map((r) => r.contentHash)).size).toBe(2);
    expect(textOf(after.pdf)).toContain(again.revisions[0].contentHash.slice(0, 12));
  });
});

describe('reading a sheet changes nothing', () => {
  it('answers GET sheet.pdf with 404 and a sentence before any revision is issued, and issues none', async () => {
    const fresh = await installer.post('/api/projects').send({ name: 'Nothing issued yet (demo)' });
    expect(fresh.status).toBe(201);
    const id = fresh.body.project.id as number;
    const res = await installer.get(`/api/projects/${id}/sheet.pdf`);
    expect(res.status).toBe(404);
    expect(res.body.error).toMatch(/No sheet has been issued/);
    const status = (await installer.get(`/api/projects/${id}/sheet`)).body as SheetStatusDto;
    expect(status.revisions).toEqual([]);
  });

  it('renders the latest issued revision on GET after the project changed, without issuing a new one', async () => {
    const issued = (await installer.post(`/api/projects/${projectId}/sheet/revisions`)).body.revision.number as number;
    const { project } = await engine();
    const p = project.placements[0];
    expect(
      (await installer.patch(`/api/projects/${projectId}/placements/${p.id}`).send({ version: p.version, heightM: p.heightM + 0.1 }))
        .status,
    ).toBe(200);
    const before = await revisionCount();

    // A top-level GET, as a link from another site would make it, with a cross-site fetch header.
    const res = await getPdf(installer).set('Sec-Fetch-Site', 'cross-site');
    expect(res.status).toBe(200);
    expect(Number(res.headers['x-sheet-revision'])).toBe(issued);
    expect(await revisionCount()).toBe(before);
    const status = (await installer.get(`/api/projects/${projectId}/sheet`)).body as SheetStatusDto;
    expect(status.current.changedSinceLast).toBe(true);
  });

  it('prints a named older revision with the content it was issued with, not the current content', async () => {
    const { project, f } = await engine();
    const p = project.placements[0];
    const oldHeight = f.dist(p.heightM);
    const first = (await installer.post(`/api/projects/${projectId}/sheet/revisions`)).body.revision.number as number;
    expect(
      (await installer.patch(`/api/projects/${projectId}/placements/${p.id}`).send({ version: p.version, heightM: p.heightM + 0.35 }))
        .status,
    ).toBe(200);
    const second = await installer.post(`/api/projects/${projectId}/sheet/revisions`);
    expect(second.status).toBe(201);
    expect(second.body.revision.number).toBe(first + 1);
    // Issuing again with nothing changed returns the same revision (200, not a new one).
    const again = await installer.post(`/api/projects/${projectId}/sheet/revisions`);
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ created: false, revision: { number: first + 1 } });

    const old = await getPdf(installer, `?revision=${first}`);
    expect(old.status).toBe(200);
    expect(Number(old.headers['x-sheet-revision'])).toBe(first);
    const oldText = textOf(old.body as Buffer);
    expect(oldText).toContain(`Height of the mirror centre ${oldHeight}`);
    expect(textOf((await getPdf(installer, `?revision=${first + 1}`)).body as Buffer)).toContain(
      `Height of the mirror centre ${f.dist(p.heightM + 0.35)}`,
    );
  });

  it('refuses to issue a revision for a request from another site (403), and issues none', async () => {
    const { project } = await engine();
    const p = project.placements[0];
    expect(
      (await installer.patch(`/api/projects/${projectId}/placements/${p.id}`).send({ version: p.version, heightM: p.heightM + 0.05 }))
        .status,
    ).toBe(200);
    const before = await revisionCount();
    const res = await installer
      .post(`/api/projects/${projectId}/sheet/revisions`)
      .set('Origin', 'https://elsewhere-demo.example')
      .set('Sec-Fetch-Site', 'cross-site');
    expect(res.status).toBe(403);
    expect(await revisionCount()).toBe(before);
  });

  it.each([['0'], ['1.0'], ['0x2'], ['-1'], ['two']])('refuses revision=%s with 400 and a sentence', async (value) => {
    const res = await installer.get(`/api/projects/${projectId}/sheet.pdf?revision=${encodeURIComponent(value)}`);
    expect(res.status).toBe(400);
    expect(res.body.fields.revision).toMatch(/whole number/);
  });

  it('answers 404 for a revision number that was never issued', async () => {
    const res = await installer.get(`/api/projects/${projectId}/sheet.pdf?revision=999`);
    expect(res.status).toBe(404);
    expect(res.body.error).toMatch(/no revision 999/);
  });
});

describe('e-mailing the sheet', () => {
  it('delivers the sheet to the buyer through the fake SMTP server with a byte-identical attachment, Reply-To the sender', async () => {
    const to = 'buyer.desk@purchasing-demo.example';
    const sent = await installer.post(`/api/projects/${projectId}/sheet/email`).send({ to, message: 'For the purchase request, please.' });
    expect(sent.status).toBe(200);
    const mail = await h.waitForMail(to);
    const parsed = await simpleParser(mail.raw);
    expect(parsed.text).toContain('For the purchase request, please.');
    // Replies go to the installer who sent it; the From line stays the product's own address.
    expect(parsed.replyTo?.value.map((v) => v.address)).toEqual([EMAIL.installer]);
    expect(parsed.from?.value.map((v) => v.address)).not.toContain(EMAIL.installer);
    expect(parsed.attachments).toHaveLength(1);
    const att = parsed.attachments[0];
    expect(att.contentType).toBe('application/pdf');
    expect(att.filename).toBe(sent.body.filename);
    const { pdf } = await fetchSheet(installer);
    expect(Buffer.compare(att.content, pdf)).toBe(0);
  });

  it('names the project and the revision in the subject, so a buyer can tell one job\u2019s sheet from another', async () => {
    const to = 'subject.check@purchasing-demo.example';
    const sent = await installer.post(`/api/projects/${projectId}/sheet/email`).send({ to });
    const parsed = await simpleParser((await h.waitForMail(to)).raw);
    const project = (await installer.get(`/api/projects/${projectId}`)).body.project as ProjectDto;
    expect(parsed.subject).toBe(`Mirror specification sheet: ${project.name}, revision ${sent.body.revision.number}`);
  });

  it("lets the admin open a sent sheet's PDF from the outbox, byte for byte what the buyer got", async () => {
    const to = 'outbox.open@purchasing-demo.example';
    const sent = await installer.post(`/api/projects/${projectId}/sheet/email`).send({ to });
    const parsed = await simpleParser((await h.waitForMail(to)).raw);
    const admin = await h.signedIn(EMAIL.admin);
    const message = (await admin.get('/api/outbox')).body.messages.find((m: { to: string[] }) => m.to.includes(to));
    expect(message.attachments[0].filename).toBe(sent.body.filename);
    const res = await admin.get(`/api/outbox/${message.id}/attachments/0`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(Buffer.compare(res.body as Buffer, parsed.attachments[0].content)).toBe(0);
    expect((await admin.get(`/api/outbox/${message.id}/attachments/1`)).status).toBe(404);
    const bad = await admin.get(`/api/outbox/${message.id}/attachments/first`);
    expect(bad.status).toBe(400);
    expect(bad.body.fields.index).toMatch(/numbered from 0/);
    // The installer is not the admin: the outbox is not theirs to read.
    expect((await installer.get(`/api/outbox/${message.id}/attachments/0`)).status).toBe(403);
  });

  it('puts the paper size in the file name of the attachment and the download', async () => {
    const a4 = await fetchSheet(installer, 'paper=a4');
    const letter = await fetchSheet(installer, 'paper=letter');
    expect(a4.res.headers['content-disposition']).toMatch(/-rev\d+-a4\.pdf"$/);
    expect(letter.res.headers['content-disposition']).toMatch(/-rev\d+-letter\.pdf"$/);
  });

  it('refuses an address that is not one with 400 and a sentence for the field', async () => {
    const res = await installer.post(`/api/projects/${projectId}/sheet/email`).send({ to: 'buyer at purchasing' });
    expect(res.status).toBe(400);
    expect(res.body.fields.to).toMatch(/e-mail address/);
  });

  it("does not let another installer fetch, inspect or send someone else's sheet", async () => {
    const other = await h.signedIn(OTHER_INSTALLER);
    expect((await other.get(`/api/projects/${projectId}/sheet.pdf`)).status).toBe(404);
    expect((await other.get(`/api/projects/${projectId}/sheet`)).status).toBe(404);
    const sent = await other.post(`/api/projects/${projectId}/sheet/email`).send({ to: 'leak@elsewhere-demo.example' });
    expect(sent.status).toBe(404);
  });

  it('lets a reviewer of the same organisation download the sheet', async () => {
    const reviewer = await h.signedIn(EMAIL.reviewer);
    const res = await reviewer.get(`/api/projects/${projectId}/sheet.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
  });

  it("does not let another installer issue a revision of someone else's sheet", async () => {
    const other = await h.signedIn(OTHER_INSTALLER);
    const before = await revisionCount();
    expect((await other.post(`/api/projects/${projectId}/sheet/revisions`)).status).toBe(404);
    expect(await revisionCount()).toBe(before);
  });

  it('reports a send the mail server refused as queued, keeps the revision, and delivers it from the outbox later, replies still going to the sender', async () => {
    // A real nodemailer transport toward a port where nothing listens.
    const closedPort = await new Promise<number>((resolve) => {
      const s = net.createServer();
      s.listen(0, '127.0.0.1', () => {
        const port = (s.address() as net.AddressInfo).port;
        s.close(() => resolve(port));
      });
    });
    const broken = createApp({
      config: h.config,
      orm: h.orm,
      mailer: createMailer({ fakePort: closedPort, from: h.config.mailFrom }),
      log: createLogger(true),
      sessionSecret: 'another-secret-long-enough-for-the-config-check',
    });
    broken.outbox.stop();
    try {
      const agent = request.agent(broken.app);
      expect((await agent.post('/api/auth/sign-in').send({ email: EMAIL.installer, password: 'demo-password-1' })).status).toBe(200);
      const to = 'retry.buyer@purchasing-demo.example';
      const queued = await agent.post(`/api/projects/${projectId}/sheet/email`).send({ to });
      expect(queued.status).toBe(200);
      expect(queued.body.delivery).toBe('queued');
      const status = (await agent.get(`/api/projects/${projectId}/sheet`)).body as SheetStatusDto;
      expect(status.current.changedSinceLast).toBe(false);

      // The working app's outbox picks the row up once its retry is due.
      await h.orm.em.fork().nativeUpdate(OutgoingMail, { toAddress: to }, { nextAttemptAt: new Date(0) });
      await h.outbox.runOnce();
      const mail = await h.waitForMail(to);
      expect(mail.subject).toContain(`revision ${status.current.number}`);
      expect(mail.attachments.map((a) => a.contentType)).toEqual(['application/pdf']);
      // The buyer's answer still goes to the installer who sent it, though the worker sent it later.
      expect((await simpleParser(mail.raw)).replyTo?.value.map((v) => v.address)).toEqual([EMAIL.installer]);
    } finally {
      broken.close();
    }
  });

  it('reports a send the mail server accepted as sent', async () => {
    const res = await installer.post(`/api/projects/${projectId}/sheet/email`).send({ to: 'quick.buyer@purchasing-demo.example' });
    expect(res.body.delivery).toBe('sent');
  });
});

describe('drawing the plan', () => {
  it('pushes a label down a line at a time until it no longer overlaps one already placed', () => {
    const first = { x: 100, y: 200, w: 60, h: LABEL_LINE_PT };
    const wanted = { x: 130, y: 203, w: 50, h: LABEL_LINE_PT };
    const spot = labelSpot(wanted, [first]);
    expect(spot.x).toBe(wanted.x);
    expect(spot.y).toBeGreaterThanOrEqual(first.y + first.h);
    expect(spot.y - wanted.y).toBeCloseTo(Math.ceil((first.y + first.h - wanted.y) / LABEL_LINE_PT) * LABEL_LINE_PT);
    expect(labelSpot({ ...wanted, y: first.y + 40 }, [first]).y).toBe(first.y + 40);
  });

  it('drops outline points too fine to print and keeps every point of a coarse shape', () => {
    // A circle of 300 points, 50 pt across: most points are closer than 0.2 mm to the chord between their neighbours.
    const circle = Array.from({ length: 300 }, (_, i): [number, number] => [
      50 * Math.cos((2 * Math.PI * i) / 300),
      50 * Math.sin((2 * Math.PI * i) / 300),
    ]);
    const simple = simplifyRing(circle, OUTLINE_TOLERANCE_PT);
    expect(simple.length).toBeLessThan(circle.length / 3);
    // No dropped point lies farther than the tolerance from the circle drawn through the kept ones (sagitta of the longest chord).
    const longest = Math.max(
      ...simple.map((p, i) => Math.hypot(p[0] - simple[(i + 1) % simple.length][0], p[1] - simple[(i + 1) % simple.length][1])),
    );
    expect(50 - Math.sqrt(50 ** 2 - (longest / 2) ** 2)).toBeLessThanOrEqual(OUTLINE_TOLERANCE_PT);
    expect(simplifyRing(circle, OUTLINE_TOLERANCE_PT)).toEqual(simple);
    const square: [number, number][] = [
      [0, 0],
      [40, 0],
      [40, 40],
      [0, 40],
    ];
    // The shared simplification returns the ring closed (first point repeated).
    expect(simplifyRing(square, OUTLINE_TOLERANCE_PT)).toEqual([...square, square[0]]);
  });
});

describe('GET /api/projects/:id/sheet/recipient', () => {
  const ask = (agent: Agent | ReturnType<typeof request>, to: string) =>
    agent.get(`/api/projects/${projectId}/sheet/recipient?to=${encodeURIComponent(to)}`);

  it('answers whether an address leaves the organisation by the hourly limit’s rule: not one of its users, however typed', async () => {
    expect((await ask(installer, 'buyer.desk@purchasing-demo.example')).body).toEqual({ outsideOrganisation: true });
    expect((await ask(installer, EMAIL.reviewer)).body).toEqual({ outsideOrganisation: false });
    expect((await ask(installer, ` ${EMAIL.reviewer.toUpperCase()} `)).body).toEqual({ outsideOrganisation: false });
    // Same domain as the demo users, but no one of the organisation: outside.
    const stranger = `nobody.here@${EMAIL.installer.split('@')[1]}`;
    expect((await ask(installer, stranger)).body).toEqual({ outsideOrganisation: true });
  });

  it('refuses a missing or broken address with 400 and a sentence for the field', async () => {
    const res = await ask(installer, 'not-an-address');
    expect(res.status).toBe(400);
    expect(res.body.fields.to).toMatch(/e-mail address/);
    expect((await installer.get(`/api/projects/${projectId}/sheet/recipient`)).status).toBe(400);
  });

  it.each([
    ['anonymous', 401, null],
    ['the project’s installer', 200, EMAIL.installer],
    ['another installer', 404, OTHER_INSTALLER],
    ['a reviewer of the organisation', 200, EMAIL.reviewer],
    ['an admin of the organisation', 200, EMAIL.admin],
  ])('answers %s with %d', async (_who, expected, email) => {
    const agent = email ? await h.signedIn(email) : request(h.app);
    expect((await ask(agent, 'buyer.desk@purchasing-demo.example')).status).toBe(expected);
  });
});
