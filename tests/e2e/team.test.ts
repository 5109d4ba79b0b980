/**
 * The team around a project, end to end in Debian's Chromium: the demo administrator invites a person, changes a
 * role and adds someone to a project (as does the engineer); a save over someone else's change is refused with a reload offer (409);
 * the invited person follows the link caught by the development mailbox, sets a password and lands in the
 * organisation with the role given. Names and addresses are invented.
 */
import { describe, expect, inject, it } from 'vitest';
import { projectSchema } from '../../shared/contracts';
import type { Page } from 'playwright-core';
import { browserForFile, signIn, signOut } from './browser';

const baseUrl = inject('baseUrl');
const stamp = Date.now().toString(36);
const inviteeEmail = `hana.liddell.${stamp}@invented.example`;

const browser = browserForFile();

/** From the projects list: opens the project's members and adds the demo viewer Ruth Okonjo from the organisation. */
async function addDemoViewerToProject(page: Page, projectName: string): Promise<void> {
  await page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: projectName }).click();
  await page.getByRole('heading', { level: 1, name: projectName }).waitFor();
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Members' }).click();
  const table = page.getByRole('table', { name: 'Project members' });
  await table.getByRole('cell', { name: 'Tomas Rennick', exact: true }).waitFor();
  await expect(table.getByRole('cell', { name: 'Ruth Okonjo', exact: true }).count()).resolves.toBe(0);
  await page.getByLabel('Person').selectOption({ label: 'Ruth Okonjo — Viewer (viewer@demo.stillspan.test)' });
  await page.getByRole('button', { name: 'Add to project' }).click();
  await table.getByRole('cell', { name: 'Ruth Okonjo', exact: true }).waitFor();
}

describe('organisation and project team in the browser', () => {
  it('lets the administrator invite a person and change a role on the members page', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'admin@demo.stillspan.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { level: 1, name: 'Members' }).waitFor();

    const invite = page.getByRole('form', { name: 'Invite a person' });
    await invite.getByLabel('E-mail').fill('not-an-address');
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await invite.getByText('E-mail must be an e-mail address').waitFor();

    await invite.getByLabel('E-mail').fill(inviteeEmail);
    await invite.getByLabel('Role').selectOption('viewer');
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByRole('status').filter({ hasText: 'Invitation sent' }).waitFor();
    await page.getByRole('table', { name: 'Pending invitations' }).getByRole('cell', { name: inviteeEmail }).waitFor();

    const viewerRole = page.getByLabel('Role of Ruth Okonjo');
    await viewerRole.selectOption('owner');
    await page.getByRole('status').filter({ hasText: 'Role changed' }).waitFor();
    await expect(viewerRole.inputValue()).resolves.toBe('owner');
    await viewerRole.selectOption('viewer');
    await expect.poll(() => viewerRole.inputValue()).toBe('viewer');
    await expect(page.getByLabel('Role of Imogen Vale').isDisabled()).resolves.toBe(true);
    await browser.shot('team-01-members-admin');
  });

  it('lets the administrator add an organisation member to a project', async () => {
    const { page } = browser;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Projects' }).click();
    await addDemoViewerToProject(page, 'Wrenmoor Mill footbridge');
    await browser.shot('team-02-project-members-admin');
  });

  it('refuses a save over a change made meanwhile and offers a reload', async () => {
    const { page } = browser;
    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Overview' }).click();
    await page.getByRole('button', { name: 'Edit details' }).click();
    const form = page.getByRole('form', { name: 'Edit project details' });
    await form.getByLabel('Location').fill('Wrenmoor, north bank (invented place)');

    // Someone else saves first (the same API the page uses, on the same session).
    const projectId = new URL(page.url()).pathname.split('/')[2];
    const current = projectSchema.parse(await (await page.request.get(`${baseUrl}/api/projects/${projectId}`)).json());
    const changed = await page.request.patch(`${baseUrl}/api/projects/${projectId}`, {
      data: { version: current.version, description: `Changed meanwhile ${stamp} (invented demo scenario).` },
    });
    expect(changed.status()).toBe(200);

    await form.getByRole('button', { name: 'Save changes' }).click();
    await page.getByRole('status').filter({ hasText: 'Changed by someone else — reload' }).waitFor();
    browser.consumeExpectedResponseError(409, `/api/projects/${projectId}`);
    await browser.shot('team-04-stale-save');

    await page.getByRole('button', { name: 'Reload project' }).click();
    await expect.poll(() => form.getByLabel('Description').inputValue()).toContain(`Changed meanwhile ${stamp}`);
    await form.getByLabel('Location').fill('Wrenmoor, north bank (invented place)');
    await form.getByRole('button', { name: 'Save changes' }).click();
    await page.getByRole('status').filter({ hasText: 'Project details saved' }).waitFor();
    await page.getByText('Wrenmoor, north bank (invented place)').first().waitFor();

    await signOut(page);
  });

  it('lets the invited person follow the mailed link, set a password and land with the role given', async () => {
    const { page } = browser;
    // The mailbox holds live invitation links: only the demo organisation's admin reads it.
    await signIn(page, baseUrl, 'admin@demo.stillspan.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Dev mailbox' }).click();
    await page.getByRole('heading', { level: 1, name: 'Mailbox' }).waitFor();
    const mail = page.getByRole('article').filter({ hasText: inviteeEmail });
    await mail.waitFor();
    await browser.shot('team-05-dev-mailbox');
    const link = await mail.getByRole('link', { name: /\/invitations\// }).getAttribute('href');
    expect(link).toMatch(/\/invitations\/[A-Za-z0-9_-]+$/);
    await signOut(page);

    // The invited person follows the link on their own.
    await page.goto(link!);
    await page.getByRole('heading', { name: 'Join Stillspan' }).waitFor();
    await page.getByText(inviteeEmail).waitFor();

    await page.getByLabel('Your name').fill('Hana Liddell');
    await page.getByLabel('Password').fill('short');
    await page.getByRole('button', { name: 'Join and sign in' }).click();
    await page.getByText('Password must be at least 10 characters').waitFor();
    await browser.shot('team-06-invitation');

    await page.getByLabel('Password').fill('a-long-invented-passphrase');
    await page.getByRole('button', { name: 'Join and sign in' }).click();
    await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
    const banner = page.getByRole('banner');
    await banner.getByText('Hana Liddell').waitFor();
    await banner.getByText('Viewer', { exact: true }).waitFor();
    await expect(page.getByRole('button', { name: 'New project' }).count()).resolves.toBe(0);

    await signOut(page);
    await signIn(page, baseUrl, inviteeEmail, 'a-long-invented-passphrase');
  });

  it('lets the engineer add an organisation member to a project too', async () => {
    const { page } = browser;
    await signOut(page);
    await signIn(page, baseUrl, 'engineer@demo.stillspan.test');
    await addDemoViewerToProject(page, 'Caskett Yard offices, level 3 floor');
    await browser.shot('team-07-project-members-engineer');
    await signOut(page);
  });

  it('logged no console errors', () => {
    expect(browser.consoleErrors).toEqual([]);
  });
});
