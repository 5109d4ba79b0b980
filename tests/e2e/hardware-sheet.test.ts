/**
 * The hardware sheet end to end in Debian's Chromium: a design of the invented demo footbridge (a copy of a demo
 * variant made here, so other suites' variants stay as they are) is submitted and approved through the API, and the
 * demo fabricator reaches its hardware sheet from the project's sections, reads the rows and downloads the CSV and PDF.
 */
import { describe, expect, inject, it } from 'vitest';
import { browserForFile, signIn, signOut } from './browser';
import { approvedFootbridgeCopy, openFootbridge } from './demo-design';

const baseUrl = inject('baseUrl');
const browser = browserForFile();
const copyName = 'Hardware sheet check (invented demo variant)';

describe('hardware sheet', () => {
  let projectId = '';
  let signOffId = '';

  it('says that no sheet exists yet, with the caution, while no design of the project is approved', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'fabricator@demo.stillspan.test');
    // The invented demo floor: no design of it is submitted by any suite.
    await page.goto(`${baseUrl}/projects`);
    await page.getByRole('link', { name: /Caskett Yard offices/ }).first().click();
    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: /Hardware sheet/ }).click();
    await page.getByRole('status').filter({ hasText: 'No hardware sheet yet' }).waitFor();
    await expect(page.getByRole('complementary', { name: 'Caution' }).textContent()).resolves.toContain('judgement of a qualified engineer');
    await browser.shot('hardware-sheet-00-none-yet');
    await signOut(page);
  });

  it('is there for the fabricator once the owner approves a design', async () => {
    const { page } = browser;
    ({ projectId, signOffId } = await approvedFootbridgeCopy(page, baseUrl, copyName));

    await signIn(page, baseUrl, 'fabricator@demo.stillspan.test');
    await openFootbridge(page, baseUrl);
    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: /Hardware sheet/ }).click();
    const sheet = page.getByRole('region', { name: `Hardware sheet · ${copyName}` });
    await sheet.waitFor();
    await sheet.getByRole('cell', { name: 'Spring rate per spring' }).waitFor();
    await sheet.getByText(/judgement of a qualified engineer/).waitFor();
    const csv = await sheet.getByRole('link', { name: 'Download CSV' }).getAttribute('href');
    const pdf = await sheet.getByRole('link', { name: 'Download PDF' }).getAttribute('href');
    expect(csv).toBe(`/api/projects/${projectId}/sign-offs/${signOffId}/hardware-sheet.csv`);
    expect(pdf).toBe(`/api/projects/${projectId}/sign-offs/${signOffId}/hardware-sheet.pdf`);
    const files = await page.evaluate(async ([a, b]) => {
      const [c, p] = await Promise.all([fetch(a), fetch(b)]);
      return { csv: (await c.text()).split('\r\n')[0], pdfType: p.headers.get('content-type'), pdfStatus: p.status };
    }, [csv!, pdf!]);
    expect(files).toEqual({ csv: 'section,quantity,value,unit,note', pdfType: 'application/pdf', pdfStatus: 200 });
    await browser.shot('hardware-sheet-01-fabricator');
    expect(browser.consoleErrors).toEqual([]);
  });
});
