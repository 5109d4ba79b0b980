/**
 * Shared by the end-to-end suites: Debian's Chromium through playwright-core with a fresh profile, every console
 * error of the page collected, and the sign-in steps. The demo password is the invented demo organisation's.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject } from 'vitest';

export const demoPassword = 'stillspan-demo';

export interface Browser {
  context: BrowserContext;
  page: Page;
  /** Console errors and uncaught exceptions of the page, in order. */
  consoleErrors: string[];
  shot(name: string): Promise<void>;
  /**
   * Removes the one console line Chromium writes for an HTTP error answer the step expects (for example the 409
   * of a stale save): it must be there exactly once, and every other console error still fails the suite.
   */
  consumeExpectedResponseError(status: number, pathPart: string): void;
  close(): Promise<void>;
}

export async function openBrowser(resultsDir: string): Promise<Browser> {
  const profileDir = mkdtempSync(join(tmpdir(), 'stillspan-e2e-chromium-'));
  const context = await chromium.launchPersistentContext(profileDir, {
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
  const page = context.pages()[0] ?? (await context.newPage());
  const consoleErrors: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(`${message.text()} @ ${message.location().url}`);
  });
  page.on('pageerror', (error) => consoleErrors.push(`uncaught: ${error.message}`));

  return {
    context,
    page,
    consoleErrors,
    async shot(name) {
      await page.screenshot({ path: join(resultsDir, `${name}.png`), fullPage: true });
    },
    consumeExpectedResponseError(status, pathPart) {
      const matches = consoleErrors
        .map((line, index) => ({ line, index }))
        .filter(({ line }) => line.includes(`status of ${status}`) && line.includes(pathPart));
      expect(matches.map(({ line }) => line)).toHaveLength(1);
      consoleErrors.splice(matches[0].index, 1);
    },
    async close() {
      await context.close();
      rmSync(profileDir, { recursive: true, force: true });
    },
  };
}

/**
 * One browser for the calling test file: opened before its tests and closed after them. Call it at the top level of
 * the file; the browser's parts can be used inside the tests.
 */
export function browserForFile(): Browser {
  let opened: Browser | undefined;
  const current = (): Browser => {
    if (!opened) throw new Error('The browser opens before the first test; use it inside a test.');
    return opened;
  };
  beforeAll(async () => {
    opened = await openBrowser(inject('resultsDir'));
  });
  afterAll(async () => {
    await opened?.close();
  });
  return {
    get context() {
      return current().context;
    },
    get page() {
      return current().page;
    },
    get consoleErrors() {
      return current().consoleErrors;
    },
    shot: (name) => current().shot(name),
    consumeExpectedResponseError: (status, pathPart) => current().consumeExpectedResponseError(status, pathPart),
    close: () => current().close(),
  };
}

/** Fills in the sign-in form on the page shown and submits it. */
export async function submitSignIn(page: Page, email: string, password = demoPassword): Promise<void> {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

export async function signIn(page: Page, baseUrl: string, email: string, password = demoPassword): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
  await submitSignIn(page, email, password);
  await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
}

export async function signOut(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
  expect(new URL(page.url()).pathname).toBe('/sign-in');
}

/** Creates a project with the projects page's form (signed in as an engineer or admin) and opens it. */
export async function createAndOpenProject(page: Page, projectName: string): Promise<void> {
  await page.getByRole('button', { name: 'New project' }).click();
  const newProject = page.getByRole('form', { name: 'New project' });
  await newProject.getByLabel('Project name').fill(projectName);
  await newProject.getByRole('button', { name: 'Create project' }).click();
  await page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: projectName }).click();
  await page.getByRole('heading', { level: 1, name: projectName }).waitFor();
}
