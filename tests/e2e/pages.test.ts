/**
 * The pages around the main job, end to end in Debian's Chromium: the caution on every page and on the About page,
 * the 404 page, a project that does not exist, the narrow-screen layout, and a session that ends while a page is
 * open. The demo accounts are the invented demo organisation's.
 */
import { describe, expect, inject, it } from 'vitest';
import { browserForFile, signIn, signOut, submitSignIn } from './browser';

const baseUrl = inject('baseUrl');
const browser = browserForFile();

describe('pages around the main job', () => {
  it('carries the engineering caution in the footer and on the About page', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl}/about`);
    await page.getByRole('heading', { level: 1, name: 'Stillspan' }).waitFor();
    await expect(page.title()).resolves.toBe('About · Stillspan');
    const caution = page.getByRole('region', { name: 'Caution' });
    await expect(caution.textContent()).resolves.toMatch(/qualified engineer, who remains responsible/);
    const footer = page.getByRole('contentinfo');
    await expect(footer.textContent()).resolves.toMatch(/qualified engineer, who remains responsible/);
    await expect(footer.textContent()).resolves.toMatch(/Local codes, the project's specification and licensed practice govern/);
    await browser.shot('pages-01-about');
  });

  it('can be used from the keyboard, with a visible focus ring', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    await page.keyboard.press('Tab');
    const skip = page.getByRole('link', { name: 'Skip to content' });
    await expect(skip.evaluate((element) => element === document.activeElement)).resolves.toBe(true);
    await expect(skip.isVisible()).resolves.toBe(true);

    await page.getByLabel('E-mail').focus();
    await page.keyboard.press('Tab');
    const password = page.getByLabel('Password');
    await expect(password.evaluate((element) => element === document.activeElement)).resolves.toBe(true);
    const outline = await password.evaluate((element) => {
      const style = getComputedStyle(element);
      return { style: style.outlineStyle, width: parseFloat(style.outlineWidth) };
    });
    expect(outline.style).toBe('solid');
    expect(outline.width).toBeGreaterThanOrEqual(2);
    await browser.shot('pages-02-keyboard-focus');
  });

  it('answers an unknown address with the 404 page inside the site frame', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl}/no/such/page`);
    await page.getByRole('heading', { level: 1, name: 'Page not found' }).waitFor();
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
  });

  it('says so when a project does not exist in the organisation', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'viewer@demo.stillspan.test');
    const missingId = '00000000-0000-4000-8000-000000000000';
    await page.goto(`${baseUrl}/projects/${missingId}`);
    await page.getByRole('heading', { level: 1, name: 'Project not found' }).waitFor();
    browser.consumeExpectedResponseError(404, `/api/projects/${missingId}`);
  });

  it('fits a narrow screen', async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${baseUrl}/projects`);
    await page.getByRole('list', { name: 'Projects' }).waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await browser.shot('pages-03-projects-narrow');
    await page.setViewportSize({ width: 1280, height: 860 });
    await signOut(page);
  });

  it('sends a person whose session ended to sign-in, and back to the page afterwards', async () => {
    const { page, context } = browser;
    await signIn(page, baseUrl, 'engineer@demo.stillspan.test');
    await page.getByRole('button', { name: 'New project' }).click();
    await context.clearCookies();
    const form = page.getByRole('form', { name: 'New project' });
    await form.getByLabel('Project name').fill('Session test footbridge (invented)');
    await form.getByRole('button', { name: 'Create project' }).click();
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    browser.consumeExpectedResponseError(401, '/api/projects');
    expect(new URL(page.url()).searchParams.get('next')).toBe('/projects');

    await submitSignIn(page, 'engineer@demo.stillspan.test');
    await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/projects');
  });

  it('logged no console errors', () => {
    expect(browser.consoleErrors).toEqual([]);
  });
});
