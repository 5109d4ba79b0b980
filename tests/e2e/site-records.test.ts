/**
 * Site records end to end in Debian's Chromium: the demo fabricator opens the demo footbridge's site records (two
 * invented records made by the seed), uploads a record made in the test from a known free decay, and sees its
 * analysis, its spectrum and its comparison with the design mode; the demo viewer sees the records without any
 * control to change them. Names and numbers are invented.
 */
import { describe, inject, it } from 'vitest';
import { decayRecord } from '../../shared/engine/signal/test-records';
import { browserForFile, signIn, signOut } from './browser';

const baseUrl = inject('baseUrl');
const browser = browserForFile();
const fileName = `heel-drop-${Date.now().toString(36)}-invented.csv`;

/** A free decay of a 1.95 Hz, 1.5 % oscillator at 50 Hz for 60 s, with light noise (test input, not a measurement). */
function decayCsv(): string {
  const samples = decayRecord({ frequencyHz: 1.95, dampingRatio: 0.015, sampleRateHz: 50 }, 60, 5, { noiseStd: 1e-4, quietS: 2 });
  return ['time_s;deck_mps2', ...Array.from(samples, (a, i) => `${(i / 50).toFixed(2)};${a.toPrecision(7)}`)].join('\n');
}

async function openSiteRecords(email: string) {
  const { page } = browser;
  await signIn(page, baseUrl, email);
  await page.getByRole('list', { name: 'Projects' }).getByRole('link', { name: 'Wrenmoor Mill footbridge' }).click();
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Site records' }).click();
  await page.getByRole('region', { name: 'Site records' }).getByRole('button', { name: /wrenmoor-heel-drop-with-damper\.csv/ }).waitFor();
}

describe('site records in the browser', () => {
  it('lets the fabricator upload a record and see its spectrum and the comparison with the design mode', async () => {
    const { page } = browser;
    await openSiteRecords('fabricator@demo.stillspan.test');
    const form = page.getByRole('form', { name: 'Upload a site record' });
    await page.locator('#site-record-file').setInputFiles({ name: fileName, mimeType: 'text/csv', buffer: Buffer.from(decayCsv()) });
    await form.getByText(fileName).waitFor();
    await form.getByLabel('Design mode to compare with').selectOption({ label: 'First vertical (FE model, invented) (1.87 Hz)' });
    await form.getByLabel('Condition').selectOption('without-damper');
    await form.getByRole('button', { name: 'Upload and analyse' }).click();
    await page.getByText('Record stored and analysed').waitFor();
    const record = page.getByRole('article', { name: `Site record ${fileName}` });
    // The decay the test made: 1.95 Hz, shown to four significant digits.
    await record.getByLabel('Analysis').getByText('1.95 Hz', { exact: true }).waitFor();
    await record.getByRole('img', { name: /^Spectrum: Welch PSD/ }).waitFor();
    await record.getByRole('img', { name: /^Free decay band-passed/ }).waitFor();
    await record.getByRole('img', { name: /^Time history of deck_mps2/ }).waitFor();
    const comparison = record.getByRole('table', { name: /Measured against the design mode/ });
    await comparison.getByRole('cell', { name: '1.87 Hz', exact: true }).waitFor();
    await record.getByRole('button', { name: 'Analyse again' }).waitFor();
    await page.getByRole('complementary', { name: 'Caution' }).getByText(/qualified engineer/).waitFor();
    await browser.shot('site-records-01-uploaded');
    await signOut(page);
  });

  it('shows the viewer the records with no control to change them', async () => {
    const { page } = browser;
    await openSiteRecords('viewer@demo.stillspan.test');
    if ((await page.getByRole('form', { name: 'Upload a site record' }).count()) !== 0) throw new Error('the viewer sees the upload form');
    await page.getByRole('button', { name: /wrenmoor-heel-drop-with-damper\.csv/ }).click();
    const record = page.getByRole('article', { name: 'Site record wrenmoor-heel-drop-with-damper.csv' });
    await record.getByText(/Damping the damper adds/).waitFor();
    await record.getByRole('img', { name: /^Spectrum: Welch PSD/ }).waitFor();
    for (const name of ['Analyse again', 'Delete record']) {
      if ((await record.getByRole('button', { name }).count()) !== 0) throw new Error(`the viewer sees "${name}"`);
    }
    await browser.shot('site-records-02-viewer');
    await signOut(page);
  });
});
