/**
 * As-built records end to end in Debian's Chromium: a copy of a variant of the invented demo footbridge (made here,
 * so other suites' variants stay as they are) is submitted and approved through the API; the demo fabricator opens
 * its hardware sheet, records both units (the form refuses a negative mass next to the field first), and sees the
 * deviation and the plain-words warning for a unit tuned above the tuning range; the viewer reads it without a form.
 * The measured values are invented.
 */
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserForFile, signIn, signOut } from './browser';
import { api, approvedFootbridgeCopy, openFootbridge } from './demo-design';

const baseUrl = inject('baseUrl');
const browser = browserForFile();
const copyName = 'As-built check (invented demo variant)';

async function openHardwareSheet(page: Page) {
  await openFootbridge(page, baseUrl);
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: /Hardware sheet/ }).click();
  const section = page.getByRole('region', { name: `As built · ${copyName}` });
  await section.waitFor();
  return section;
}

describe('as-built records', () => {
  let projectId = '';
  let signOffId = '';
  let recordedMassKg = 0;

  it('the fabricator records the units of an approved design and sees the deviation and an out-of-range warning', async () => {
    const { page } = browser;
    ({ projectId, signOffId } = await approvedFootbridgeCopy(page, baseUrl, copyName));

    await signIn(page, baseUrl, 'fabricator@demo.stillspan.test');
    const section = await openHardwareSheet(page);
    const sheet = (await api(page, 'GET', `/api/projects/${projectId}/sign-offs/${signOffId}/hardware-sheet`)).json as { rows: { quantity: string; value: number }[] };
    const row = (quantity: string) => sheet.rows.find((r) => r.quantity === quantity)!.value;
    const massKg = row('Moving mass per unit');
    const highHz = row('Frequency, high end');
    await section.getByText(/judgement of a qualified engineer/).waitFor();
    await section.getByText('No as-built record yet.').waitFor();

    // A negative mass is refused next to its field before anything is sent.
    const mass1 = section.getByLabel('Unit 1, moving mass [kg]');
    const mass2 = section.getByLabel('Unit 2, moving mass [kg]');
    await mass1.fill('-3');
    await mass2.fill(String(Math.round(massKg)));
    await section.getByRole('button', { name: 'Add as-built record' }).click();
    await section.getByText('Moving mass [kg] must be between 0.1 and 1000000 kg').waitFor();
    expect(await mass1.getAttribute('aria-invalid')).toBe('true');
    await section.screenshot({ path: `${inject('resultsDir')}/as-built-00-form-error.png` });

    // Unit 1 5 % heavy; unit 2 tuned 10 % above the high end of the tuning range.
    const heavyKg = Math.round(massKg * 1.05);
    recordedMassKg = heavyKg;
    const fastHz = Number((highHz * 1.1).toFixed(2));
    await mass1.fill(String(heavyKg));
    await section.getByLabel('Unit 2, tuned frequency [Hz]').fill(String(fastHz));
    await section.getByLabel('Note on this record').fill('First weighing after installation (invented)');
    await section.getByRole('button', { name: 'Add as-built record' }).click();
    const latest = section.getByRole('region', { name: 'Latest as-built record' });
    await latest.waitFor();
    const warning = latest.getByRole('alert');
    await warning.getByText('Outside the tuning range: unit 2').waitFor();
    await warning.getByText(new RegExp(`^Unit 2: measured ${fastHz} Hz is above the tuning range [\\d.]+–[\\d.]+ Hz; add mass or soften the springs$`)).waitFor();
    const unit1 = latest.getByRole('row', { name: /^Unit 1/ });
    await unit1.getByText(`${new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 4 }).format(heavyKg)} kg`, { exact: true }).waitFor();
    const percent = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 2 }).format(((heavyKg - massKg) / massKg) * 100);
    await unit1.getByText(`(+${percent} %)`, { exact: false }).waitFor();
    await latest.getByRole('row', { name: /^Unit 2/ }).getByText('ABOVE range').waitFor();
    await browser.shot('as-built-01-fabricator');
    await section.screenshot({ path: `${inject('resultsDir')}/as-built-01-section.png` });

    // A re-measurement after adjustment is a new record; the first one is kept below.
    await section.getByLabel('Unit 2, tuned frequency [Hz]').fill(String(row('Target frequency').toFixed(3)));
    await section.getByRole('button', { name: 'Add as-built record' }).click();
    await section.getByRole('region', { name: 'Earlier as-built records' }).getByText(/outside the range: unit 2/).waitFor();
    await latest.getByText('Every unit recorded is inside the tuning range of the hardware sheet.').waitFor();
    await browser.shot('as-built-02-re-measured');
    expect(browser.consoleErrors).toEqual([]);
    await signOut(page);
  });

  it('the viewer reads the records without a form', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'viewer@demo.stillspan.test');
    const section = await openHardwareSheet(page);
    await section.getByRole('region', { name: 'Latest as-built record' }).waitFor();
    await section.getByText(/the fabricator, an engineer or an admin records them/).waitFor();
    expect(await section.getByRole('button', { name: 'Add as-built record' }).count()).toBe(0);
    await browser.shot('as-built-03-viewer');
    expect(browser.consoleErrors).toEqual([]);
    await signOut(page);
  });

  it('shows the fabricator who reads US customary units those beside the SI values; the form says it takes SI', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'fabricator@demo.stillspan.test');
    await openFootbridge(page, baseUrl);
    const setUnits = async (unitSystem: string) => (await api(page, 'PATCH', '/api/me/preferences', { unitSystem })).status;
    expect(await setUnits('us-customary')).toBe(200);
    try {
      const section = await openHardwareSheet(page);
      await page.reload();
      await section.waitFor();
      const form = section.getByRole('form', { name: 'Record the units as built' });
      await form.getByRole('columnheader', { name: /^Moving mass \[kg, SI\]/ }).waitFor();
      await form.getByText('This form takes SI units (kg, N/m, Hz)').waitFor();
      const latest = section.getByRole('region', { name: 'Latest as-built record' });
      const unit1 = latest.getByRole('row', { name: /^Unit 1/ });
      // 1 lb = 0.45359237 kg exactly (NIST SP 811, appendix B.8); four significant figures beside the SI value.
      const pounds = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 4 }).format(recordedMassKg / 0.45359237);
      const kilograms = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 4 }).format(recordedMassKg);
      await unit1.getByText(`${kilograms} kg · ${pounds} lb`, { exact: true }).waitFor();
      await latest.getByRole('columnheader', { name: /^Spring rate \(N\/m · lbf\/in\)/ }).waitFor();
      await browser.shot('as-built-04-us-customary');
      await section.screenshot({ path: '/tmp/shots-client/as-built-us-customary.png' });
    } finally {
      expect(await setUnits('si')).toBe(200);
    }
    expect(browser.consoleErrors).toEqual([]);
  });
});
