/**
 * The review loop end to end, two people at once: the installer on a phone (390×844) sends the
 * demo job; the safety officer on a wide screen (1440×900) finds it in the queue with the keyboard,
 * comments (pinned to a mirror and to a point) and returns it; the installer answers, resolves and
 * sends again; the officer approves with the keyboard; the sheet's text shows the approval and the
 * approved content hash; the buyer's e-mail reaches the fake SMTP server.
 */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import type { Page } from 'playwright-core';
import sqlite3 from 'sqlite3';
import { DEMO_PROJECT } from '../../server/seeders/demo-project';
import { DEMO_REVIEW_JOB } from '../../server/seeders/demo-review-job';
import type { ProjectDto } from '../../shared/schemas';
import { PHONE, WIDE, byTestId, openPage, shot, productForFile, signInAs, demoUser } from './browser';

const product = productForFile();

const reviewer = demoUser('reviewer');
/** An invented buyer outside the demo organisation. */
const BUYER = 'buyer.desk@purchasing-demo.example';

type MailRow = { to_addresses: string; subject: string; attachments: string };

/** What the fake SMTP server stored (table mail_message in the product's own SQLite file). */
function receivedMail(): Promise<MailRow[]> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(path.join(product.dir, 'e2e.sqlite'), sqlite3.OPEN_READONLY);
    db.all<MailRow>('select to_addresses, subject, attachments from mail_message order by id', (err, rows) => {
      db.close();
      if (err) reject(err);
      else resolve(rows);
    });
  });
}

async function mailTo(address: string, timeoutMs = 15_000): Promise<MailRow> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const hit = (await receivedMail()).find((m) => (JSON.parse(m.to_addresses) as string[]).includes(address));
    if (hit) return hit;
    if (Date.now() > until) throw new Error(`no mail for ${address} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function projectAsSeenBy(page: Page, id: number): Promise<ProjectDto> {
  const res = await page.request.get(`${product.server.url}/api/projects/${id}`);
  return ((await res.json()) as { project: ProjectDto }).project;
}

async function stateIs(page: Page, words: string) {
  await page.waitForFunction(
    (w) =>
      (globalThis as unknown as { document: { querySelector(s: string): { textContent: string | null } | null } }).document.querySelector(
        '[data-testid="project-state"]',
      )?.textContent === w,
    words,
    { timeout: 15_000 },
  );
}

describe('two people close the review loop', () => {
  let phone: Page;
  let wide: Page;
  let phoneErrors: string[];
  let wideErrors: string[];
  let projectId = 0;

  beforeAll(async () => {
    ({ page: phone, errors: phoneErrors } = await openPage(product, PHONE));
    ({ page: wide, errors: wideErrors } = await openPage(product, WIDE));
    await signInAs(phone, product, 'installer');
    await signInAs(wide, product, 'reviewer');
  });

  it('shows the installer each job’s state in the project list', async () => {
    await phone.goto(`${product.server.url}/projects`);
    const row = phone.locator('[data-testid^="project-row-"]', { hasText: DEMO_PROJECT.name });
    await row.waitFor();
    projectId = Number((await row.getAttribute('data-testid'))!.replace('project-row-', ''));
    await expect(byTestId(phone, `project-status-${projectId}`).textContent()).resolves.toBe('Being drawn up');
    // The demo's second job was seeded as sent, so the list shows more than one state.
    const other = phone.locator('[data-testid^="project-row-"]', { hasText: DEMO_REVIEW_JOB.name });
    await expect(other.locator('[data-testid^="project-status-"]').textContent()).resolves.toBe('Waiting for a reviewer');
    await shot(phone, 'review-phone-projects');
  });

  it('lets the installer on a phone send the job to the named reviewer', async () => {
    await phone.goto(`${product.server.url}/projects/${projectId}`);
    await stateIs(phone, 'Being drawn up');
    await byTestId(phone, 'drawer-toggle').click();
    const reviewerChip = phone.locator('[data-testid^="send-reviewer-"]', { hasText: reviewer.name });
    await reviewerChip.click();
    await shot(phone, 'review-phone-send');
    await byTestId(phone, 'review-send').click();
    await stateIs(phone, 'Waiting for a reviewer');
    await expect(byTestId(phone, 'review-sentence').textContent()).resolves.toContain(reviewer.name);
  });

  it('puts the job in the reviewer’s queue, reached and opened with the keyboard', async () => {
    await wide.goto(`${product.server.url}/reviews`);
    await byTestId(wide, `queue-row-${projectId}`).waitFor();
    const rows = await wide.locator('[data-testid="queue-table"] [role="row"][data-testid^="queue-row-"]').count();
    await expect(byTestId(wide, 'queue-count-with_reviewer').textContent()).resolves.toMatch(new RegExp(`^${rows}`));
    // Tab from the last sort button lands on the first row (the longest waiting); ↓ moves on until
    // ours (sent just now, so last); Enter opens it.
    await byTestId(wide, 'queue-sort-installer').focus();
    await wide.keyboard.press('Tab');
    const focused = () =>
      wide.evaluate(() =>
        (
          globalThis as unknown as { document: { activeElement: { getAttribute(n: string): string | null } } }
        ).document.activeElement.getAttribute('data-testid'),
      );
    expect(await focused()).toMatch(/^queue-row-/);
    for (let i = 1; i < rows && (await focused()) !== `queue-row-${projectId}`; i++) await wide.keyboard.press('ArrowDown');
    expect(await focused()).toBe(`queue-row-${projectId}`);
    await shot(wide, 'review-wide-queue');
    await wide.keyboard.press('Enter');
    await wide.waitForURL(`**/projects/${projectId}`);
    await stateIs(wide, 'Waiting for a reviewer');
  });

  it('lets the reviewer pin a comment to a mirror and another to a point, both shown on the plan', async () => {
    const row = wide.locator('[data-testid^="summary-placement-"]').first();
    await row.waitFor();
    const mirrorId = Number((await row.getAttribute('data-testid'))!.replace('summary-placement-', ''));
    const mirrorLabel = (await projectAsSeenBy(wide, projectId)).placements.find((p) => p.id === mirrorId)!.label;
    await row.click();
    await byTestId(wide, 'comment-pin-placement').click();
    await byTestId(wide, 'comment-body').fill('This mirror shows the racking end, not the crossing. Aim it 10° further left.');
    await byTestId(wide, 'comment-submit').click();
    await byTestId(wide, 'comment-marker-1').waitFor({ state: 'attached' });

    await byTestId(wide, 'comment-pin-point').click();
    await byTestId(wide, 'comment-pick-point').click();
    const box = (await byTestId(wide, 'plan-canvas').boundingBox())!;
    await wide.mouse.click(box.x + box.width * 0.55, box.y + box.height * 0.5);
    await byTestId(wide, 'comment-marker-pending').waitFor({ state: 'attached' });
    await byTestId(wide, 'comment-body').fill('A pedestrian door opens here; check it is seen.');
    await byTestId(wide, 'comment-submit').click();
    await byTestId(wide, 'comment-marker-2').waitFor({ state: 'attached' });
    await expect(byTestId(wide, 'comment-thread-1').textContent()).resolves.toContain(`On mirror ${mirrorLabel}`);
    await expect(byTestId(wide, 'comment-thread-2').textContent()).resolves.toContain('At a point on the plan');
    await shot(wide, 'review-wide-comments');
  });

  it('lets the reviewer return the job with a reason, from the keyboard', async () => {
    await byTestId(wide, 'review-return').focus();
    await wide.keyboard.press('Enter');
    await byTestId(wide, 'return-reason').waitFor();
    await wide.keyboard.type('Fix the aim of the pinned mirror and answer the door comment.');
    await wide.keyboard.press('Control+Enter');
    await stateIs(wide, 'Returned to the installer');
    await shot(wide, 'review-wide-returned');
  });

  it('shows the installer the reasons; they answer, resolve and send the job again', async () => {
    await phone.reload();
    await stateIs(phone, 'Returned to the installer');
    await byTestId(phone, 'drawer-toggle').click();
    const reason = phone.locator('[data-testid^="comment-thread-"]', { hasText: 'Reason for return' });
    await reason.waitFor();
    await byTestId(phone, 'comment-reply-1').click();
    await byTestId(phone, 'reply-body-1').fill('Turned it towards the crossing.');
    await byTestId(phone, 'reply-submit-1').click();
    await phone.getByText('Turned it towards the crossing.').waitFor();
    for (const n of [1, 2, 3]) {
      await byTestId(phone, `comment-resolve-${n}`).click();
      await byTestId(phone, `comment-resolved-${n}`).waitFor();
    }
    await shot(phone, 'review-phone-resolved');
    await byTestId(phone, 'review-send').click();
    await stateIs(phone, 'Waiting for a reviewer');
  });

  it('lets the reviewer approve with the keyboard, and the timeline records every step', async () => {
    await wide.reload();
    await stateIs(wide, 'Waiting for a reviewer');
    await byTestId(wide, 'review-approve').focus();
    await wide.keyboard.press('Enter');
    await stateIs(wide, 'Approved');
    await expect(byTestId(wide, 'review-sentence').textContent()).resolves.toContain(`Approved by ${reviewer.name}`);
    for (const kind of ['sent', 'commented', 'returned', 'comment_resolved', 'approved']) {
      await byTestId(wide, `timeline-event-${kind}`).first().waitFor({ state: 'attached' });
    }
    await shot(wide, 'review-wide-approved');
  });

  it('prints the approval, who gave it and the approved content hash on the sheet', async () => {
    const project = await projectAsSeenBy(wide, projectId);
    expect(project.approval).not.toBeNull();
    const issued = await wide.request.post(`${product.server.url}/api/projects/${projectId}/sheet/revisions`);
    const { revision } = (await issued.json()) as { revision: { number: number; contentHash: string } };
    expect(revision.contentHash).toBe(project.approval!.contentHash);
    const pdf = await wide.request.get(`${product.server.url}/api/projects/${projectId}/sheet.pdf?revision=${revision.number}`);
    const text = execFileSync('/usr/bin/pdftotext', ['-', '-'], { input: await pdf.body(), encoding: 'utf8' });
    expect(text).toContain(`Approved: revision ${project.approval!.revision}`);
    expect(text).toContain(reviewer.name);
    expect(text.replace(/\s+/g, '')).toContain(project.approval!.contentHash);
    expect(text).not.toContain('NOT APPROVED');
  });

  it('sends the approved sheet to the buyer without a warning, and the e-mail arrives with the PDF', async () => {
    await phone.reload();
    await stateIs(phone, 'Approved');
    await byTestId(phone, 'drawer-toggle').click();
    await byTestId(phone, 'sheet-email-to').scrollIntoViewIfNeeded();
    await byTestId(phone, 'sheet-email-to').fill(BUYER);
    await byTestId(phone, 'sheet-email-submit').click();
    await byTestId(phone, 'sheet-email-sent').waitFor({ timeout: 30_000 });
    expect(await byTestId(phone, 'sheet-email-confirm').count()).toBe(0);
    await shot(phone, 'review-phone-emailed');
    const mail = await mailTo(BUYER);
    const attachments = JSON.parse(mail.attachments) as { filename?: string; contentType?: string }[];
    expect(attachments.some((a) => a.contentType === 'application/pdf')).toBe(true);
  });

  it('withdraws the approval when the installer then changes a mirror: the screen and the sheet say so', async () => {
    // The round panel on the rack's end face takes a new height within the mounting rule (as in the conflict test).
    const row = phone.locator('[data-testid^="summary-placement-"]', { hasText: 'M2 dock corner' }).first();
    await row.click();
    await byTestId(phone, 'placement-height').fill('3.35 m');
    await byTestId(phone, 'placement-height').press('Tab');
    // The editor saves by itself 900 ms after the last change (AUTOSAVE_MS); on a loaded machine that
    // can come before a click on "Save now", which is then disabled, so the test waits on the effect.
    await stateIs(phone, 'Being drawn up');
    await byTestId(phone, 'placement-save-status').filter({ hasText: 'All changes saved.' }).waitFor();
    await shot(phone, 'review-phone-withdrawn');

    const issued = await phone.request.post(`${product.server.url}/api/projects/${projectId}/sheet/revisions`);
    const { revision } = (await issued.json()) as { revision: { number: number } };
    const pdf = await phone.request.get(`${product.server.url}/api/projects/${projectId}/sheet.pdf?revision=${revision.number}`);
    const text = execFileSync('/usr/bin/pdftotext', ['-', '-'], { input: await pdf.body(), encoding: 'utf8' });
    expect(text).toContain('NOT APPROVED');
  });

  // A 401 from /api/auth/me before signing in is how the app learns it is signed out; the browser logs it.
  it('raised no error in either browser', () => {
    expect(phoneErrors.filter((e) => !/Failed to load resource/.test(e))).toEqual([]);
    expect(wideErrors.filter((e) => !/Failed to load resource/.test(e))).toEqual([]);
  });
});
