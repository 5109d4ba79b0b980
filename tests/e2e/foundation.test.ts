/**
 * The foundation end to end, in Debian's Chromium: the demo engineer signs in, creates a project, finds it listed
 * and signs out; the demo fabricator signs in and is offered no way to create a project. The demo accounts and
 * password are the invented demo organisation's (seeded outside production).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';

const baseUrl = inject('baseUrl');
const resultsDir = inject('resultsDir');
const demoPassword = 'stillspan-demo';

let profileDir: string;
let context: BrowserContext;
let page: Page;
const consoleErrors: string[] = [];

function shot(name: string) {
  return page.screenshot({ path: join(resultsDir, `${name}.png`), fullPage: true });
}

async function signIn(email: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
}

async function signOut() {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
  expect(new URL(page.url()).pathname).toBe('/sign-in');
}

beforeAll(async () => {
  profileDir = mkdtempSync(join(tmpdir(), 'stillspan-e2e-chromium-'));
  context = await chromium.launchPersistentContext(profileDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 860 },
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  context.setDefaultTimeout(15_000);
  page = context.pages()[0] ?? (await context.newPage());
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(`${message.text()} (${message.location().url})`);
  });
  page.on('pageerror', (error) => consoleErrors.push(`uncaught: ${error.message}`));
});

afterAll(async () => {
  await context?.close();
  if (profileDir) rmSync(profileDir, { recursive: true, force: true });
});

describe('foundation in the browser', () => {
  const projectName = `Millrace footbridge ${Date.now().toString(36)}`;

  it('sends a visitor without a session to the sign-in page, which lists the demo accounts', async () => {
    await page.goto(`${baseUrl}/projects`);
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await expect(page.getByRole('button', { name: /demo engineer account engineer@demo\.stillspan\.test/i }).count()).resolves.toBe(1);
    await shot('01-sign-in');
  });

  it('refuses a wrong password with a message and stays on the sign-in page', async () => {
    await page.getByLabel('E-mail').fill('engineer@demo.stillspan.test');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.getByRole('alert').filter({ hasText: 'do not match an account' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
  });

  it('lets the demo engineer create a project and find it listed, then sign out', async () => {
    await signIn('engineer@demo.stillspan.test');
    await shot('02-projects-engineer');

    await page.getByRole('button', { name: 'New project' }).click();
    const form = page.getByRole('form', { name: 'New project' });

    // An empty name is refused in the form, naming the field (the same zod schema as the server's).
    await form.getByRole('button', { name: 'Create project' }).click();
    await form.getByText('Project name is required').waitFor();

    await form.getByLabel('Project name').fill(projectName);
    await form.getByLabel('Structure kind').selectOption('footbridge');
    await form.getByLabel('Location').fill('Invented riverside park (demo)');
    await form.getByRole('button', { name: 'Create project' }).click();
    await page.getByRole('status').filter({ hasText: 'Project created' }).waitFor();

    const listed = page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: projectName });
    await listed.waitFor();
    await shot('03-project-created');

    // Still there after a reload: it was stored, not only cached.
    await page.reload();
    await page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: projectName }).waitFor();

    await page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: projectName }).click();
    await page.getByRole('heading', { level: 1, name: projectName }).waitFor();
    await page.getByRole('button', { name: 'Edit details' }).waitFor();
    await shot('04-project-page-engineer');

    await signOut();
  });

  it('offers the demo fabricator no way to create a project', async () => {
    await page.getByRole('button', { name: /demo fabricator account fabricator@demo\.stillspan\.test/i }).click();
    await expect(page.getByLabel('E-mail').inputValue()).resolves.toBe('fabricator@demo.stillspan.test');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();

    // The fabricator reads the organisation's projects, including the one the engineer just made.
    await page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: projectName }).waitFor();
    await expect(page.getByRole('button', { name: /new project|create project/i }).count()).resolves.toBe(0);
    await expect(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Members' }).count()).resolves.toBe(0);
    await shot('05-projects-fabricator');

    await page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: projectName }).click();
    await page.getByRole('heading', { level: 1, name: projectName }).waitFor();
    await expect(page.getByRole('button', { name: 'Edit details' }).count()).resolves.toBe(0);

    await signOut();
  });

  it('logged no console errors', () => {
    expect(consoleErrors).toEqual([]);
  });
});
