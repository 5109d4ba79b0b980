/**
 * Deep links and sign-out end to end in Debian's Chromium, with the invented demo organisation:
 * - signing out from a page with live queries: the signed-in pages are gone and requests in flight aborted before the
 *   session ends, so nothing is sent after it (no 401, no console error);
 * - a deep link opened signed out (as from a mail) asks the server only who is signed in before the sign-in page,
 *   and after signing in the person lands on the page the link named.
 */
import { mkdirSync } from 'node:fs';
import { describe, expect, inject, it } from 'vitest';
import type { Page, Request } from 'playwright-core';
import { browserForFile, signIn, submitSignIn } from './browser';

const baseUrl = inject('baseUrl');
const browser = browserForFile();
const shots = '/tmp/shots-client';
mkdirSync(shots, { recursive: true });

/** The API requests the page sends from now on, by method and path. */
function recordApiRequests(page: Page): { requests: string[]; stop(): void } {
  const requests: string[] = [];
  const listener = (request: Request) => {
    const url = new URL(request.url());
    if (url.pathname.startsWith('/api/')) requests.push(`${request.method()} ${url.pathname}`);
  };
  page.on('request', listener);
  return { requests, stop: () => page.off('request', listener) };
}

/** The API answers with status 401 from now on. */
function recordUnauthorised(page: Page): string[] {
  const answers: string[] = [];
  page.on('response', (response) => {
    if (response.status() === 401) answers.push(response.url());
  });
  return answers;
}

describe('deep links and sign-out', () => {
  let deepLink = '';

  it('signing out from a page with live queries sends no request after the session ends', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'engineer@demo.stillspan.test');
    await page.getByRole('link', { name: /Wrenmoor Mill footbridge/ }).first().click();
    await page.waitForURL(/\/projects\/[0-9a-f-]{36}/);
    const projectId = /\/projects\/([0-9a-f-]{36})/.exec(page.url())![1];
    deepLink = `/projects/${projectId}/structures`;

    // A page with live queries: the structures, loaded.
    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: /Structures/ }).click();
    await page.getByRole('region', { name: 'Structures and modes' }).getByRole('link').first().waitFor();

    // The server ends the session at once, but its answer is held back: the moment a page could still fetch.
    let release: () => void = () => undefined;
    const released = new Promise<void>((resolve) => (release = resolve));
    await page.route('**/api/auth/signout', async (route) => {
      const response = await route.fetch();
      await released;
      await route.fulfill({ response });
    });

    const unauthorised = recordUnauthorised(page);
    const afterClick = recordApiRequests(page);
    await page.getByRole('button', { name: 'Sign out' }).click();
    // The signed-in pages are gone before the session ends, so nothing is left to click or to refetch…
    await page.getByRole('navigation', { name: 'Project sections' }).waitFor({ state: 'detached' });
    // …not even on coming back to the window.
    await page.evaluate(() => {
      document.dispatchEvent(new Event('visibilitychange'));
      window.dispatchEvent(new Event('focus'));
    });
    await page.waitForTimeout(300);
    release();
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.waitForTimeout(500);
    await page.unroute('**/api/auth/signout');
    afterClick.stop();

    // Only Auth.js's own sign-out exchange leaves after the click.
    expect(afterClick.requests.filter((request) => !request.includes('/api/auth/'))).toEqual([]);
    expect(afterClick.requests).toContain('POST /api/auth/signout');
    expect(unauthorised).toEqual([]);
    await page.screenshot({ path: `${shots}/deep-links-01-signed-out.png`, fullPage: true });
    expect(browser.consoleErrors).toEqual([]);
  });

  it('a deep link opened signed out asks only for the session, then lands on the page after signing in', async () => {
    const { page } = browser;
    const unauthorised = recordUnauthorised(page);
    const beforeSignIn = recordApiRequests(page);
    await page.goto(`${baseUrl}${deepLink}`);
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    const url = new URL(page.url());
    expect(url.pathname).toBe('/sign-in');
    expect(url.searchParams.get('next')).toBe(deepLink);
    await page.waitForTimeout(500); // any loader still running would have sent its request by now
    beforeSignIn.stop();
    // Who is signed in (Auth.js's session endpoint, 200 with nobody) and the server's public configuration.
    expect([...new Set(beforeSignIn.requests)].sort()).toEqual(['GET /api/auth/session', 'GET /api/config']);
    expect(unauthorised).toEqual([]);
    expect(browser.consoleErrors).toEqual([]);
    await page.screenshot({ path: `${shots}/deep-links-02-sign-in-with-next.png`, fullPage: true });

    await submitSignIn(page, 'engineer@demo.stillspan.test');
    await page.waitForURL(`${baseUrl}${deepLink}`);
    const panel = page.getByRole('region', { name: 'Structures and modes' });
    await panel.waitFor();
    await panel.getByRole('link').first().waitFor();
    await page.screenshot({ path: `${shots}/deep-links-03-landed.png`, fullPage: true });
    expect(unauthorised).toEqual([]);
    expect(browser.consoleErrors).toEqual([]);
  });
});
