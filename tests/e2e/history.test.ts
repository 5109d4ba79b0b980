/**
 * The project's history end to end in Debian's Chromium: the demo engineer makes a project with a structure, changes
 * the structure's span, and reads the change in the project's history in plain words with the value before and
 * after; the filter by what happened leaves only the change; the demo viewer reads the same history. Names and
 * numbers are invented.
 */
import { describe, inject, it } from 'vitest';
import { browserForFile, createAndOpenProject, signIn, signOut } from './browser';

const baseUrl = inject('baseUrl');
const stamp = Date.now().toString(36);
const projectName = `Fallowmere footbridge ${stamp} (invented)`;
const structureName = 'West span (invented)';

const browser = browserForFile();

describe('project history in the browser', () => {
  it('shows the engineer a change with its person, its thing and the value before and after', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'engineer@demo.stillspan.test');
    await createAndOpenProject(page, projectName);

    const sections = page.getByRole('navigation', { name: 'Project sections' });
    await sections.getByRole('link', { name: 'Structures and modes' }).click();
    await page.getByRole('button', { name: 'New structure' }).click();
    const structureForm = page.getByRole('form', { name: 'New structure' });
    await structureForm.getByLabel('Structure name').fill(structureName);
    await structureForm.getByLabel('Span [m]').fill('30');
    await structureForm.getByRole('button', { name: 'Add structure' }).click();
    await page.getByRole('heading', { level: 2, name: structureName }).waitFor();

    await page.getByRole('button', { name: 'Edit structure' }).click();
    const edit = page.getByRole('form', { name: 'Edit structure' });
    await edit.getByLabel('Span [m]').fill('34');
    await edit.getByRole('button', { name: 'Save changes' }).click();
    await page.getByText('Structure saved').waitFor();

    await sections.getByRole('link', { name: 'History' }).click();
    const changes = page.getByRole('list', { name: 'Changes, newest first' });
    const changed = changes.getByRole('listitem').filter({ hasText: `Tomas Rennick changed the structure “${structureName}”` });
    await changed.waitFor();
    await changed.getByText('30 m', { exact: true }).waitFor();
    await changed.getByText('34 m', { exact: true }).waitFor();
    await changes.getByRole('listitem').filter({ hasText: `Tomas Rennick added the structure “${structureName}”` }).waitFor();
    await browser.shot('history-01-change-before-after');

    // Only changes: the structure's creation leaves the list.
    await page.getByLabel('What happened').selectOption('update');
    await page.getByRole('button', { name: 'Show' }).click();
    await page.getByRole('region', { name: 'Changes that match' }).waitFor();
    await changes.getByRole('listitem').filter({ hasText: 'added the structure' }).waitFor({ state: 'detached' });
    await changed.waitFor();
    await browser.shot('history-02-filtered');
    await signOut(page);
  });

  it('shows the viewer the same history', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'viewer@demo.stillspan.test');
    await page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: projectName }).click();
    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'History' }).click();
    await page.getByRole('list', { name: 'Changes, newest first' }).getByRole('listitem').filter({ hasText: `changed the structure “${structureName}”` }).waitFor();
    await signOut(page);
  });
});
