/**
 * Sign-off end to end in Debian's Chromium: the demo engineer submits a seeded variant of the invented demo
 * footbridge, a second submission is refused (409) with a clear notice, the demo owner reads the design as a decision
 * and approves it, and the engineer sees it approved in the timeline. The organisation, bridge and variant are invented.
 */
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserForFile, signIn, signOut } from './browser';

const baseUrl = inject('baseUrl');
const browser = browserForFile();

const variantName = 'Den Hartog 2 % (invented demo variant)';
const message = 'Please approve the Den Hartog damper for the main span (e2e).';
const comment = 'Approved for fabrication drawings (e2e).';

async function openFootbridgeSection(page: Page, section: RegExp): Promise<void> {
  await page.goto(`${baseUrl}/projects`);
  await page.getByRole('link', { name: /Wrenmoor Mill footbridge/ }).first().click();
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: section }).click();
}

describe('sign-off', () => {
  it('lets the engineer submit a variant, and refuses a second submission while it waits', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'engineer@demo.stillspan.test');
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

  it('shows the owner the design as a decision and records the approval', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'owner@demo.stillspan.test');
    await openFootbridgeSection(page, /Sign-off/);
    const decision = page.getByRole('region', { name: `Decision asked: ${variantName}` });
    await decision.waitFor();
    await expect(decision.textContent()).resolves.toContain(message);
    // From the snapshot: the damper, each load case with its margin, the detuning check and the caution.
    await decision.getByText('Damper frequency').waitFor();
    expect(await decision.getByTestId('decision-load-case').count()).toBeGreaterThan(0);
    await expect(decision.getByTestId('decision-load-case').first().textContent()).resolves.toMatch(/m\/s².*m\/s².*%/);
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
    await browser.shot('sign-off-05-owner-approved');
    await signOut(page);
  });

  it('shows the engineer the approval in the timeline', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'engineer@demo.stillspan.test');
    await openFootbridgeSection(page, /Sign-off/);
    const entry = page.getByTestId('sign-off-entry').filter({ hasText: variantName }).first();
    await entry.waitFor();
    await expect(entry.getByTestId('sign-off-status').textContent()).resolves.toBe('approved');
    await expect(entry.textContent()).resolves.toMatch(/Approved by Priya Halloran|Approved by a member of the organisation/);
    // The decided design reads again from its snapshot, without approve or return.
    await entry.getByRole('button', { name: 'Read the design as submitted' }).click();
    const asSubmitted = entry.getByRole('region', { name: `Design as submitted: ${variantName}` });
    await asSubmitted.getByText('Damper frequency').waitFor();
    await expect(asSubmitted.getByRole('button', { name: 'Approve' }).count()).resolves.toBe(0);
    await browser.shot('sign-off-06-engineer-timeline');
    expect(browser.consoleErrors).toEqual([]);
  });
});
