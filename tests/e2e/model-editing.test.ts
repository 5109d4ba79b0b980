/**
 * Changing the structural model, end to end in Debian's Chromium: the demo engineer edits a beam mode's beam and
 * sees the derived frequency follow (and stay after a reload), reads that a lumped-model mode's numbers follow its
 * model, meets a save over a mode changed meanwhile (409) and applies her change again after a reload, edits a load
 * case and comfort criteria; criteria submitted for sign-off say a change needs a new sign-off, and what an approved
 * design rests on offers no edit. The demo fabricator sees no edit action. Names and numbers are invented.
 */
import { request as playwrightRequest, type Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { projectSchema, savedModeSchema, type SavedMode } from '../../shared/contracts';
import { signOffSchema } from '../../shared/contracts/sign-offs';
import { browserForFile, demoPassword, signIn, signOut } from './browser';

const baseUrl = inject('baseUrl');
const stamp = Date.now().toString(36);
const projectName = `Ferncombe Weir footbridge ${stamp} (invented)`;
const structureName = 'Weir span (invented)';

const browser = browserForFile();

/** A number as the pages show it: four significant digits without trailing zeros. */
const shown = (value: number) => Number(value.toPrecision(4)).toString();

/** f₁ = (π / 2L²) √(EI/m) of a simply supported beam (PRODUCT spec's simple-beam formula; common practice). */
function simplySupportedFrequencyHz(lengthM: number, bendingStiffnessNM2: number, massPerLengthKgPerM: number): number {
  return (Math.PI / (2 * lengthM * lengthM)) * Math.sqrt(bendingStiffnessNM2 / massPerLengthKgPerM);
}

// The invented model, in SI.
const beam = { lengthM: 42, bendingStiffnessNM2: 3.2e9, massPerLengthKgPerM: 2400 };
const ids = { projectId: '', structureId: '', beamModeId: '', typedModeId: '', modelModeId: '', crowdId: '', criteriaId: '' };

/** POSTs JSON with the page's session (the same API the pages use) and returns the answer's body. */
async function post(page: Page, path: string, data: unknown): Promise<unknown> {
  const response = await page.request.post(`${baseUrl}${path}`, { data });
  expect(response.status(), `${path}: ${await response.text()}`).toBeLessThan(300);
  return response.json();
}

const projectPath = () => `/projects/${ids.projectId}`;
const modesApi = () => `/api/projects/${ids.projectId}/structures/${ids.structureId}/modes`;

async function openStructure(page: Page): Promise<void> {
  await page.goto(`${baseUrl}${projectPath()}/structures/${ids.structureId}`);
  await page.getByRole('heading', { level: 2, name: structureName }).waitFor();
}

describe('changing the structural model in the browser', () => {
  it('sets up an invented project through the API', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'engineer@demo.stillspan.test');
    ids.projectId = projectSchema.parse(await post(page, '/api/projects', { name: projectName, kind: 'footbridge' })).id;
    ids.structureId = ((await post(page, `/api/projects/${ids.projectId}/structures`, { name: structureName, kind: 'footbridge-span', deckAreaM2: 147 })) as { id: string }).id;
    ids.beamModeId = savedModeSchema.parse(
      await post(page, modesApi(), { label: 'First vertical bending', dampingRatio: 0.006, source: { kind: 'beam', support: 'simply-supported', ...beam } }),
    ).id;
    ids.typedModeId = savedModeSchema.parse(
      await post(page, modesApi(), { label: 'Second vertical (invented FE result)', frequencyHz: 2.05, modalMassKg: 52_000, dampingRatio: 0.005 }),
    ).id;
    const model = (await post(page, `/api/projects/${ids.projectId}/structures/${ids.structureId}/models`, {
      name: 'Span with damper (invented)',
      massMatrixKg: [
        [50_000, 0],
        [0, 1000],
      ],
      stiffnessMatrixNPerM: [
        [7.34e6, -1.4e5],
        [-1.4e5, 1.4e5],
      ],
      dofLabels: ['midspan', 'damper'],
    })) as { id: string };
    ids.modelModeId = savedModeSchema.parse(
      await post(page, modesApi(), { label: 'Coupled mode 1', dampingRatio: 0.006, source: { kind: 'lumped-model', modelId: model.id, modeNumber: 1, dofIndex: 0 } }),
    ).id;
    ids.crowdId = ((await post(page, `/api/projects/${ids.projectId}/load-cases`, {
      name: 'Crowd, Sétra class II (invented)',
      spec: { kind: 'crowd', guide: 'setra', trafficClass: 'II', deckAreaM2: 147 },
    })) as { id: string }).id;
    ids.criteriaId = ((await post(page, `/api/projects/${ids.projectId}/comfort-criteria`, { name: 'Code limit (invented)', spec: { set: 'en1990', class: 'normal-use' } })) as {
      id: string;
    }).id;
  });

  it('changes a beam mode: the derived frequency follows and stays after a reload', async () => {
    const { page } = browser;
    await openStructure(page);
    const modes = page.getByRole('table', { name: 'Design modes of the structure' });
    const before = simplySupportedFrequencyHz(beam.lengthM, beam.bendingStiffnessNM2, beam.massPerLengthKgPerM);
    await modes.getByRole('cell', { name: shown(before), exact: true }).waitFor();
    // With its Edit and Remove actions the table still fits its panel on a laptop screen: no action hides off to the right.
    const overflowPx = await modes.evaluate((table) => table.parentElement!.scrollWidth - table.parentElement!.clientWidth);
    expect(overflowPx).toBeLessThanOrEqual(0);

    await modes.getByRole('button', { name: 'Edit mode First vertical bending' }).click();
    const form = page.getByRole('form', { name: 'Edit mode First vertical bending' });
    await expect.poll(() => form.getByLabel('Length L [m]').inputValue()).toBe('42');
    await expect.poll(() => form.getByLabel('Damping ratio ζ [–]').inputValue()).toBe('0.006');
    // No typed-over frequency for a beam mode: it is derived.
    await expect(form.getByLabel('Natural frequency [Hz]').count()).resolves.toBe(0);
    await form.getByLabel('Length L [m]').fill('38');
    const after = simplySupportedFrequencyHz(38, beam.bendingStiffnessNM2, beam.massPerLengthKgPerM);
    await form.getByRole('region', { name: 'Derived from the beam' }).getByText(`${shown(after)} Hz`).waitFor();
    await browser.shot('editing-01-beam-mode');
    await form.getByRole('button', { name: 'Save mode' }).click();
    await page.getByRole('status').filter({ hasText: 'Mode “First vertical bending” saved' }).waitFor();
    await modes.getByRole('cell', { name: shown(after), exact: true }).waitFor();
    await modes.getByText('Simply supported beam, mode 1: L = 38 m').waitFor();

    await page.reload();
    await modes.getByRole('cell', { name: shown(after), exact: true }).waitFor();
    await expect(modes.getByRole('cell', { name: shown(before), exact: true }).count()).resolves.toBe(0);
  });

  it('says that a lumped-model mode follows its model and offers no frequency to type', async () => {
    const { page } = browser;
    const modes = page.getByRole('table', { name: 'Design modes of the structure' });
    await modes.getByRole('button', { name: 'Edit mode Coupled mode 1' }).click();
    const section = page.getByRole('region', { name: 'Editing mode Coupled mode 1' });
    await section.getByText('Frequency and modal mass come from the lumped model').waitFor();
    await section.getByText(/change the model “Span with damper \(invented\)” under Lumped models below/).waitFor();
    const form = section.getByRole('form', { name: 'Edit mode Coupled mode 1' });
    await expect(form.getByLabel('Natural frequency [Hz]').count()).resolves.toBe(0);
    await expect(form.getByLabel('Modal mass [kg]').count()).resolves.toBe(0);
    await expect.poll(() => form.getByLabel('Damper at').inputValue()).toBe('0');
    await browser.shot('editing-02-model-mode');
    await form.getByRole('button', { name: 'Cancel' }).click();
    await expect(section.count()).resolves.toBe(0);
  });

  it('refuses a save over a mode changed meanwhile, reloads it and saves the change applied again', async () => {
    const { page } = browser;
    const modes = page.getByRole('table', { name: 'Design modes of the structure' });
    const label = 'Second vertical (invented FE result)';
    await modes.getByRole('button', { name: `Edit mode ${label}` }).click();
    const form = page.getByRole('form', { name: `Edit mode ${label}` });
    await expect.poll(() => form.getByLabel('Natural frequency [Hz]').inputValue()).toBe('2.05');
    await form.getByLabel('Damping ratio ζ [–]').fill('0.007');

    // Someone else changes the mode's modal mass first (the same API, on the same session).
    const stored: SavedMode = savedModeSchema.parse(await (await page.request.get(`${baseUrl}${modesApi()}/${ids.typedModeId}`)).json());
    const changed = await page.request.patch(`${baseUrl}${modesApi()}/${ids.typedModeId}`, { data: { version: stored.version, modalMassKg: 54_000 } });
    expect(changed.status()).toBe(200);

    await form.getByRole('button', { name: 'Save mode' }).click();
    await form.getByRole('status').filter({ hasText: 'Someone changed this meanwhile' }).waitFor();
    await form.getByText('Reload and apply your change again').waitFor();
    browser.consumeExpectedResponseError(409, `/modes/${ids.typedModeId}`);
    await browser.shot('editing-03-mode-changed-meanwhile');

    await form.getByRole('button', { name: 'Reload mode' }).click();
    const reloaded = page.getByRole('form', { name: `Edit mode ${label}` });
    await expect.poll(() => reloaded.getByLabel('Modal mass [kg]').inputValue()).toBe('54000');
    await expect.poll(() => reloaded.getByLabel('Damping ratio ζ [–]').inputValue()).toBe('0.005');
    await expect(reloaded.getByText('Someone changed this meanwhile').count()).resolves.toBe(0);
    await reloaded.getByLabel('Damping ratio ζ [–]').fill('0.007');
    await reloaded.getByRole('button', { name: 'Save mode' }).click();
    await page.getByRole('status').filter({ hasText: `Mode “${label}” saved` }).waitFor();
    const row = modes.getByRole('row').filter({ hasText: label });
    await row.getByRole('cell', { name: '54,000', exact: true }).waitFor();
    await row.getByText('0.007 (0.7 %)').waitFor();
  });

  it('changes a load case', async () => {
    const { page } = browser;
    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Load cases' }).click();
    const list = page.getByRole('list', { name: 'Load cases' });
    await list.getByRole('button', { name: 'Edit load case Crowd, Sétra class II (invented)' }).click();
    const form = list.getByRole('form', { name: 'Edit load case Crowd, Sétra class II (invented)' });
    await expect.poll(() => form.getByLabel('Deck area [m²]').inputValue()).toBe('147');
    await form.getByLabel('Load case name').fill('Crowd, Sétra class I (invented)');
    await form.getByLabel('Traffic class', { exact: true }).selectOption('I');
    await form.getByLabel('Deck area [m²]').fill('');
    await form.getByRole('button', { name: 'Save load case' }).click();
    // The shared schema refuses a blank required field at the field, before anything is sent.
    await form.getByText('Deck area [m²] is required').waitFor();
    await form.getByLabel('Deck area [m²]').fill('160');
    await browser.shot('editing-04-load-case');
    await form.getByRole('button', { name: 'Save load case' }).click();
    await list.getByRole('status').filter({ hasText: 'Load case saved' }).waitFor();
    const card = list.getByRole('listitem').filter({ hasText: 'Crowd, Sétra class I (invented)' });
    // Sétra 2006 class I: 1.0 persons/m² (PRODUCT spec: confirmed).
    await card.getByText(/class I \(1 persons\/m², .*deck 160 m²/).waitFor();
    await page.reload();
    await list.getByRole('heading', { name: 'Crowd, Sétra class I (invented)' }).waitFor();
    await list.getByText(/deck 160 m²/).waitFor();
  });

  it('changes comfort criteria', async () => {
    const { page } = browser;
    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Comfort criteria' }).click();
    const list = page.getByRole('list', { name: 'Comfort criteria' });
    await list.getByRole('button', { name: 'Edit comfort criteria Code limit (invented)' }).click();
    const form = list.getByRole('form', { name: 'Edit comfort criteria Code limit (invented)' });
    await expect.poll(() => form.getByLabel('Situation').inputValue()).toBe('normal-use');
    await form.getByLabel('Situation').selectOption('crowd');
    await form.getByRole('button', { name: 'Save comfort criteria' }).click();
    await list.getByRole('status').filter({ hasText: 'Comfort criteria saved' }).waitFor();
    // EN 1990 A2.4.3.2: 0.4 m/s² horizontal for exceptional crowd conditions (PRODUCT spec: confirmed).
    await list.getByText(/Peak horizontal acceleration at most 0\.4 m\/s²/).waitFor();
    await page.reload();
    await list.getByText(/Peak horizontal acceleration at most 0\.4 m\/s²/).waitFor();
    await browser.shot('editing-05-criteria');
  });

  it('says that submitted criteria need a new sign-off and offers no edit of an approved design', async () => {
    const { page } = browser;
    const variant = (await post(page, `/api/projects/${ids.projectId}/variants`, {
      name: 'Den Hartog 2 % (invented)',
      modeId: ids.typedModeId,
      loadCaseIds: [ids.crowdId],
      criteriaId: ids.criteriaId,
      massRatio: 0.02,
      tuning: { method: 'den-hartog' },
    })) as { id: string };
    const signOff = signOffSchema.parse(await post(page, `/api/projects/${ids.projectId}/sign-offs`, { variantId: variant.id }));

    // The mode of the submitted design says what a change would mean when it is opened.
    await openStructure(page);
    const modes = page.getByRole('table', { name: 'Design modes of the structure' });
    await modes.getByRole('button', { name: 'Edit mode Second vertical (invented FE result)' }).click();
    await page.getByRole('region', { name: 'Editing mode Second vertical (invented FE result)' }).getByText("Waiting for the owner's sign-off").waitFor();

    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Comfort criteria' }).click();
    const list = page.getByRole('list', { name: 'Comfort criteria' });
    await list.getByText('Submitted to the owner').waitFor();
    await list.getByRole('button', { name: 'Edit comfort criteria Code limit (invented)' }).click();
    await list.getByRole('status').filter({ hasText: 'A change will need a new sign-off' }).waitFor();
    await browser.shot('editing-06-submitted-criteria');
    const form = list.getByRole('form', { name: 'Edit comfort criteria Code limit (invented)' });
    await form.getByLabel('Situation').selectOption('normal-use');

    // Meanwhile the owner approves the design (in a session of her own), which freezes the criteria.
    const owner = await playwrightRequest.newContext({ baseURL: baseUrl });
    try {
      const { csrfToken } = (await (await owner.get('/api/auth/csrf')).json()) as { csrfToken: string };
      const signedIn = await owner.post('/api/auth/callback/credentials', { form: { csrfToken, email: 'owner@demo.stillspan.test', password: demoPassword }, maxRedirects: 0 });
      expect(signedIn.status()).toBe(302);
      const approved = await owner.post(`/api/projects/${ids.projectId}/sign-offs/${signOff.id}/approve`, { data: {} });
      expect(approved.status(), await approved.text()).toBe(200);
    } finally {
      await owner.dispose();
    }

    // The save is refused in the server's words, which say what to do instead.
    await form.getByRole('button', { name: 'Save comfort criteria' }).click();
    await form.getByRole('alert').filter({ hasText: 'Not saved: an approved design rests on this' }).waitFor();
    await form.getByText(/belongs to a design the owner approved and cannot be changed or deleted; copy the variant and submit again/).waitFor();
    browser.consumeExpectedResponseError(409, `/comfort-criteria/${ids.criteriaId}`);
    await expect(form.getByRole('button', { name: 'Save comfort criteria' }).isDisabled()).resolves.toBe(true);
    await browser.shot('editing-06b-criteria-frozen-meanwhile');
    // Closed, the form leaves the criteria as they now are: approved, with no edit offered.
    await form.getByRole('button', { name: 'Cancel' }).click();
    await list.getByText(/The design the owner approved rests on these criteria, so they cannot be changed/).waitFor();
    await expect(list.getByRole('button', { name: /^Edit comfort criteria/ }).count()).resolves.toBe(0);

    await openStructure(page);
    const frozenRow = modes.getByRole('row').filter({ hasText: 'Second vertical (invented FE result)' });
    await frozenRow.getByText('Part of the approved design: fixed').waitFor();
    await expect(frozenRow.getByRole('button').count()).resolves.toBe(0);
    // The other modes stay open to change.
    await modes.getByRole('button', { name: 'Edit mode First vertical bending' }).waitFor();
    await browser.shot('editing-07-approved-mode');

    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Load cases' }).click();
    const loadCases = page.getByRole('list', { name: 'Load cases' });
    await loadCases.getByText(/The design the owner approved rests on this load case, so it cannot be changed or removed/).waitFor();
    await expect(loadCases.getByRole('button', { name: /^Edit load case/ }).count()).resolves.toBe(0);
    await browser.shot('editing-07b-approved-load-case');

    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Comfort criteria' }).click();
    const criteria = page.getByRole('list', { name: 'Comfort criteria' });
    await criteria.getByText(/The design the owner approved rests on these criteria, so they cannot be changed/).waitFor();
    await expect(criteria.getByRole('button', { name: /^Edit comfort criteria/ }).count()).resolves.toBe(0);
    await browser.shot('editing-08-approved-criteria');
    await signOut(page);
  });

  it('shows the fabricator no edit action', async () => {
    const { page } = browser;
    await signIn(page, baseUrl, 'fabricator@demo.stillspan.test');
    const main = page.getByRole('main');
    await openStructure(page);
    await page.getByRole('table', { name: 'Design modes of the structure' }).getByRole('cell', { name: 'First vertical bending', exact: true }).waitFor();
    await expect(main.getByRole('button', { name: /^Edit/ }).count()).resolves.toBe(0);
    await expect(main.getByText('Part of the approved design').count()).resolves.toBe(0);

    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Load cases' }).click();
    await page.getByRole('list', { name: 'Load cases' }).getByRole('heading', { name: 'Crowd, Sétra class I (invented)' }).waitFor();
    await expect(main.getByRole('button', { name: /^Edit/ }).count()).resolves.toBe(0);

    await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Comfort criteria' }).click();
    await page.getByRole('list', { name: 'Comfort criteria' }).getByRole('heading', { name: 'Code limit (invented)' }).waitFor();
    await expect(main.getByRole('button', { name: /^Edit/ }).count()).resolves.toBe(0);
    await expect(main.getByRole('form').count()).resolves.toBe(0);
    await browser.shot('editing-09-fabricator-criteria');
    await signOut(page);
  });

  it('logged no console errors', () => {
    expect(browser.consoleErrors).toEqual([]);
  });
});
