/**
 * Sign-off end to end in Debian's Chromium, the way people meet it: the demo engineer submits a seeded variant of the
 * invented demo footbridge (a second submission is refused with a clear notice); the demo owner opens the link of
 * the mail the submission sent (read in the development mailbox), signs in and lands on the sign-off page, reads the
 * design as a decision and approves it with a comment; the engineer's decision mail carries the comment and the
 * link; the demo fabricator opens the hardware sheet and downloads its PDF and CSV, which agree with the page. Every
 * step waits for what it needs on the page, never for a fixed time. The organisation, bridge and variant are invented.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, inject, it } from 'vitest';
import type { Download, Locator, Page } from 'playwright-core';
import Papa from 'papaparse';
import { PDFParse } from 'pdf-parse';
import { browserForFile, signIn, signOut, submitSignIn } from './browser';

const baseUrl = inject('baseUrl');
const browser = browserForFile();

const variantName = 'Den Hartog 2 % (invented demo variant)';
const message = 'Please approve the Den Hartog damper for the main span (e2e).';
const comment = 'Approved for fabrication drawings (e2e).';
const owner = 'owner@demo.stillspan.test';
const engineer = 'engineer@demo.stillspan.test';
const signOffLinkPattern = /\/projects\/[0-9a-f-]{36}\/sign-off$/;

async function openFootbridgeSection(page: Page, section: RegExp): Promise<void> {
  await page.goto(`${baseUrl}/projects`);
  await page.getByRole('link', { name: /Wrenmoor Mill footbridge/ }).first().click();
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: section }).click();
}

/**
 * The mail whose subject starts with `subject` and goes to `to`, in the development mailbox (which only the demo
 * organisation's admin reads, and which refreshes itself while the outbox sends in the background).
 */
async function mailInMailbox(page: Page, subject: string, to: string): Promise<Locator> {
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Dev mailbox' }).click();
  await page.getByRole('heading', { level: 1, name: 'Mailbox' }).waitFor();
  const mail = page
    .getByRole('article')
    .filter({ has: page.getByRole('heading', { name: subject }) })
    .filter({ hasText: to })
    .first();
  await mail.waitFor({ timeout: 30_000 });
  return mail;
}

/** The sign-off link of a mail: the one address in its text that points at a project's sign-off page. */
async function signOffLinkOf(mail: Locator): Promise<string> {
  const link = await mail.getByRole('link', { name: signOffLinkPattern }).getAttribute('href');
  expect(link).toMatch(new RegExp(`^${baseUrl.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}/projects/[0-9a-f-]{36}/sign-off$`));
  return link!;
}

async function downloaded(download: Download): Promise<Buffer> {
  const path = await download.path();
  return readFileSync(path);
}

describe('sign-off', () => {
  let mailedLink = '';

  it('lets the engineer submit a variant, and refuses a second submission while it waits', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, engineer);
    await openFootbridgeSection(page, /Tuning variants/);
    await page.getByRole('region', { name: 'Tuning variants' }).waitFor();
    await page.getByRole('link', { name: variantName }).first().click();
    const form = page.getByRole('form', { name: 'Submit for sign-off' });
    await form.getByLabel('Message to the owner').fill(message);
    await form.getByRole('button', { name: 'Submit for sign-off' }).click();
    await page.getByText('Submitted for sign-off').waitFor();
    await browser.shot('sign-off-01-submitted');

    // The same variant again, while the first waits: the server's 409 shown as a notice.
    await page.reload();
    await page.getByRole('form', { name: 'Submit for sign-off' }).getByRole('button', { name: 'Submit for sign-off' }).click();
    const notice = page.getByRole('status').filter({ hasText: 'Not submitted' });
    await notice.waitFor();
    await expect(notice.textContent()).resolves.toContain('already waits for a sign-off decision');
    browser.consumeExpectedResponseError(409, '/sign-offs');
    await browser.shot('sign-off-02-already-waiting');

    // The engineer reads the design but has no approve or return.
    await page.getByRole('link', { name: 'See the sign-offs' }).click();
    await page.getByRole('heading', { level: 2, name: `Decision asked: ${variantName}` }).waitFor();
    await expect(page.getByRole('button', { name: 'Approve' }).count()).resolves.toBe(0);
    await signOut(page);
  });

  it('mails the owner a link to the sign-off page', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'admin@demo.stillspan.test');
    const mail = await mailInMailbox(page, `Sign-off requested: ${variantName}`, owner);
    await expect(mail.textContent()).resolves.toContain(message);
    mailedLink = await signOffLinkOf(mail);
    await signOut(page);
  });

  it('takes the owner from the mailed link, through sign-in, to the design read as a decision, and records the approval', async () => {
    const { page } = browser;
    // Signed out, the link asks for sign-in first and comes back to the sign-off page.
    await page.goto(mailedLink);
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    await submitSignIn(page, owner);
    await page.waitForURL(signOffLinkPattern);
    expect(page.url()).toBe(mailedLink);
    const decision = page.getByRole('region', { name: `Decision asked: ${variantName}` });
    await decision.waitFor();
    await expect(decision.textContent()).resolves.toContain(message);
    // From the snapshot: the criteria in words and numbers, the damper, each load case with its verdict and margin,
    // the detuning check and the caution.
    await decision.getByText('Damper frequency').waitFor();
    await expect(decision.getByTestId('decision-in-short').textContent()).resolves.toMatch(
      /In short: the design (meets|does not meet) the comfort criteria.*(least margin|exceeds the limit).*structure's frequency ±\d+ %/,
    );
    await expect(decision.getByTestId('decision-criteria').textContent()).resolves.toMatch(/\d m\/s²/);
    expect(await decision.getByTestId('decision-load-case').count()).toBeGreaterThan(0);
    const firstCase = decision.getByTestId('decision-load-case').first();
    await expect(firstCase.textContent()).resolves.toMatch(/m\/s².*m\/s².*%/);
    await expect(firstCase.textContent()).resolves.toMatch(/meets the limit|exceeds the limit|no limit/);
    await decision.getByText(/If the bridge is not quite as modelled/).waitFor();
    await decision.getByRole('complementary', { name: 'Caution' }).waitFor();
    await browser.shot('sign-off-03-owner-decision');

    // Returning needs a comment: the form says so under the field and sends nothing.
    const giveBack = decision.getByRole('form', { name: 'Return the design' });
    await giveBack.getByRole('button', { name: 'Return' }).click();
    await giveBack.getByText(/What to change must say what to change/).waitFor();
    await browser.shot('sign-off-04-return-needs-comment');

    const approve = decision.getByRole('form', { name: 'Approve the design' });
    await approve.getByLabel('Comment on approval').fill(comment);
    await approve.getByRole('button', { name: 'Approve' }).click();
    await page.getByText('No design awaits a decision.').waitFor();
    const entry = page.getByTestId('sign-off-entry').filter({ hasText: variantName }).first();
    await expect(entry.getByTestId('sign-off-status').textContent()).resolves.toBe('approved');
    await expect(entry.textContent()).resolves.toContain(comment);
    // The decision's mail is sent in the background; the timeline reads again until it is sent.
    await entry.getByText(`to ${engineer} — sent`).waitFor({ timeout: 30_000 });
    await browser.shot('sign-off-05-owner-approved');
    await signOut(page);
  });

  it("mails the submitter the decision with the owner's comment and the link", async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'admin@demo.stillspan.test');
    const mail = await mailInMailbox(page, `Design approved: ${variantName}`, engineer);
    const text = (await mail.textContent()) ?? '';
    expect(text).toContain(comment);
    expect(text).toContain('Priya Halloran approved');
    expect(await signOffLinkOf(mail)).toBe(mailedLink);
    await browser.shot('sign-off-06-decision-mail');
    await signOut(page);
  });

  it('shows the engineer the approval in the timeline', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, engineer);
    await openFootbridgeSection(page, /Sign-off/);
    const entry = page.getByTestId('sign-off-entry').filter({ hasText: variantName }).first();
    await entry.waitFor();
    await expect(entry.getByTestId('sign-off-status').textContent()).resolves.toBe('approved');
    await expect(entry.textContent()).resolves.toContain('Approved by Priya Halloran');
    // The decided design reads again from its snapshot, without approve or return.
    await entry.getByRole('button', { name: 'Read the design as submitted' }).click();
    const asSubmitted = entry.getByRole('region', { name: `Design as submitted: ${variantName}` });
    await asSubmitted.getByText('Damper frequency').waitFor();
    await expect(asSubmitted.getByRole('button', { name: 'Approve' }).count()).resolves.toBe(0);
    await browser.shot('sign-off-07-engineer-timeline');
    await signOut(page);
  });

  it('gives the fabricator the hardware sheet, whose PDF and CSV agree with the page', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'fabricator@demo.stillspan.test');
    await openFootbridgeSection(page, /Hardware sheet/);
    const sheet = page.getByRole('region', { name: `Hardware sheet · ${variantName}` });
    await sheet.waitFor();
    const revision = /Revision ([0-9a-f]{8}-\d{4}-\d{2}-\d{2})/.exec((await sheet.textContent()) ?? '')?.[1];
    expect(revision).toBeDefined();
    const springRow = sheet.getByTestId('hardware-sheet-row').filter({ has: page.getByRole('cell', { name: 'Spring rate per spring', exact: true }) });
    const springOnPage = (await springRow.getByRole('cell').nth(1).textContent())?.trim();
    expect(Number(springOnPage)).toBeGreaterThan(0);
    await expect(sheet.getByRole('complementary', { name: 'Caution' }).textContent()).resolves.toContain('judgement of a qualified engineer');
    await browser.shot('sign-off-08-fabricator-sheet');

    const [csvDownload] = await Promise.all([page.waitForEvent('download'), sheet.getByRole('link', { name: 'Download CSV' }).click()]);
    expect(csvDownload.suggestedFilename()).toMatch(new RegExp(`hardware-sheet-${revision}\\.csv$`));
    // Read back by an independent RFC 4180 parser (papaparse).
    const csv = Papa.parse<string[]>((await downloaded(csvDownload)).toString('utf8'), { skipEmptyLines: true });
    expect(csv.errors).toEqual([]);
    expect(csv.data[0]).toEqual(['section', 'quantity', 'value', 'unit', 'note']);
    expect(csv.data.find((r) => r[1] === 'Revision')?.[2]).toBe(revision);
    expect(csv.data.find((r) => r[1] === 'Spring rate per spring')?.[2]).toBe(springOnPage);
    expect(csv.data.find((r) => r[1] === 'Comment')?.[2]).toBe(comment);

    const [pdfDownload] = await Promise.all([page.waitForEvent('download'), sheet.getByRole('link', { name: 'Download PDF' }).click()]);
    expect(pdfDownload.suggestedFilename()).toMatch(new RegExp(`hardware-sheet-${revision}\\.pdf$`));
    const pdf = await downloaded(pdfDownload);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    const pdfText = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(pdfText).toContain(`Revision: ${revision}`);
    expect(pdfText).toContain(springOnPage);
    expect(pdfText).toContain('judgement of a qualified engineer');
  });

  it('shows the fabricator who reads US customary units those beside the SI values, and the files stay SI', async () => {
    const { page } = browser;
    const setUnits = (unitSystem: string) =>
      page.evaluate(async (body) => {
        const response = await fetch('/api/me/preferences', { method: 'PATCH', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) });
        return response.status;
      }, { unitSystem });
    expect(await setUnits('us-customary')).toBe(200);
    try {
      await page.reload();
      const sheet = page.getByRole('region', { name: `Hardware sheet · ${variantName}` });
      await sheet.getByRole('columnheader', { name: 'US customary' }).waitFor();
      const strokeRow = sheet.getByTestId('hardware-sheet-row').filter({ has: page.getByRole('cell', { name: 'Design stroke', exact: true }) });
      const cells = strokeRow.getByRole('cell');
      const mm = Number((await cells.nth(1).textContent())?.trim());
      await expect(cells.nth(2).textContent()).resolves.toBe('mm');
      // 1 in = 25.4 mm exactly (NIST SP 811, appendix B); five significant figures on the page.
      const inches = (await cells.nth(3).textContent())?.trim() ?? '';
      expect(inches).toMatch(/ in$/);
      expect(Number(inches.replace(/ in$/, '').replace(/,/g, ''))).toBeCloseTo(mm / 25.4, 3);
      await browser.shot('sign-off-09-fabricator-sheet-us-customary');
    } finally {
      expect(await setUnits('si')).toBe(200);
    }
    expect(browser.consoleErrors).toEqual([]);
  });
});
