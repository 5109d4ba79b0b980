/**
 * The foundation end to end, in Debian's Chromium: the demo engineer signs in, creates a project, finds it listed
 * and signs out; the demo fabricator signs in and is offered no way to create a project. The demo accounts and
 * password are the invented demo organisation's (seeded outside production).
 */
import { describe, expect, inject, it } from 'vitest';
import { browserForFile, signIn, signOut, submitSignIn } from './browser';

const baseUrl = inject('baseUrl');
const browser = browserForFile();

describe('foundation in the browser', () => {
  const projectName = `Millrace footbridge ${Date.now().toString(36)}`;

  it('sends a visitor without a session to the sign-in page, which lists the demo accounts', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl}/projects`);
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    expect(new URL(page.url()).searchParams.get('next')).toBe('/projects');
    await expect(page.getByRole('button', { name: /demo engineer account engineer@demo\.stillspan\.test/i }).count()).resolves.toBe(1);
    await browser.shot('foundation-01-sign-in');
  });

  it('refuses a wrong password with a message and stays on the sign-in page', async () => {
    const { page } = browser;
    await submitSignIn(page, 'engineer@demo.stillspan.test', 'not-the-password');
    await page.getByRole('alert').filter({ hasText: 'do not match an account' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
  });

  it('lets the demo engineer create a project and find it listed, then sign out', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'engineer@demo.stillspan.test');
    await browser.shot('foundation-02-projects-engineer');

    await page.getByRole('button', { name: 'New project' }).click();
    const form = page.getByRole('form', { name: 'New project' });

    // An empty name is refused in the form, naming the field (the same zod schema as the server's).
    await form.getByRole('button', { name: 'Create project' }).click();
    await form.getByText('Project name is required').waitFor();
    await browser.shot('foundation-03-create-form-empty-name');

    await form.getByLabel('Project name').fill(projectName);
    await form.getByLabel('Structure kind').selectOption('footbridge');
    await form.getByLabel('Location').fill('Invented riverside park (demo)');
    await form.getByRole('button', { name: 'Create project' }).click();
    await page.getByRole('status').filter({ hasText: 'Project created' }).waitFor();

    const listed = () => page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: projectName });
    await listed().waitFor();
    await browser.shot('foundation-04-project-created');

    // Still there after a reload: it was stored, not only cached.
    await page.reload();
    await listed().waitFor();

    await listed().click();
    await page.getByRole('heading', { level: 1, name: projectName }).waitFor();
    await page.getByRole('button', { name: 'Edit details' }).waitFor();
    await browser.shot('foundation-05-project-page-engineer');

    await signOut(page);
  });

  it('offers the demo fabricator no way to create a project', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: /demo fabricator account fabricator@demo\.stillspan\.test/i }).click();
    await expect(page.getByLabel('E-mail').inputValue()).resolves.toBe('fabricator@demo.stillspan.test');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();

    // The fabricator reads the organisation's projects, including the one the engineer just made.
    const listed = page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: projectName });
    await listed.waitFor();
    await expect(page.getByRole('button', { name: /new project|create project/i }).count()).resolves.toBe(0);
    await expect(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Members' }).count()).resolves.toBe(0);
    await browser.shot('foundation-06-projects-fabricator');

    await listed.click();
    await page.getByRole('heading', { level: 1, name: projectName }).waitFor();
    await expect(page.getByRole('button', { name: 'Edit details' }).count()).resolves.toBe(0);

    await signOut(page);
  });

  it('logged no console errors', () => {
    expect(browser.consoleErrors).toEqual([]);
  });
});
