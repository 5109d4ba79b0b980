/**
 * An approved design of the invented demo footbridge for the end-to-end suites that need one: a copy of its Den Hartog
 * variant (made by the suite, so other suites' variants stay as they are), submitted by the demo engineer and approved
 * by the demo owner through the API from their signed-in pages.
 */
import { expect } from 'vitest';
import type { Page } from 'playwright-core';
import { signIn, signOut } from './browser';

/** A JSON request from the signed-in page (same origin, the session's cookie). */
export async function api(page: Page, method: string, path: string, body?: unknown): Promise<{ status: number; json: unknown }> {
  return page.evaluate(
    async ({ method, path, body }) => {
      const response = await fetch(path, { method, headers: body ? { 'Content-Type': 'application/json' } : {}, body: body ? JSON.stringify(body) : undefined });
      const text = await response.text();
      return { status: response.status, json: text ? (JSON.parse(text) as unknown) : null };
    },
    { method, path, body },
  );
}

/** Opens the demo footbridge from the projects list; its project id. */
export async function openFootbridge(page: Page, baseUrl: string): Promise<string> {
  await page.goto(`${baseUrl}/projects`);
  await page.getByRole('link', { name: /Wrenmoor Mill footbridge/ }).first().click();
  await page.waitForURL(/\/projects\/[0-9a-f-]{36}/);
  return /\/projects\/([0-9a-f-]{36})/.exec(page.url())![1];
}

/** Copies the footbridge's Den Hartog 2 % variant as `copyName` with two units, submits it and has it approved; signed out after. */
export async function approvedFootbridgeCopy(page: Page, baseUrl: string, copyName: string): Promise<{ projectId: string; signOffId: string }> {
  await signIn(page, baseUrl, 'engineer@demo.stillspan.test');
  const projectId = await openFootbridge(page, baseUrl);
  const list = (await api(page, 'GET', `/api/projects/${projectId}/variants`)).json as { variants: Array<Record<string, unknown>> };
  const source = list.variants.find((v) => String(v.name).startsWith('Den Hartog 2 %'))!;
  const created = await api(page, 'POST', `/api/projects/${projectId}/variants`, {
    name: copyName,
    modeId: source.modeId,
    loadCaseIds: source.loadCaseIds,
    criteriaId: source.criteriaId,
    massRatio: source.massRatio,
    tuning: source.tuning,
    unitCount: 2,
  });
  expect(created.status).toBe(201);
  const submitted = await api(page, 'POST', `/api/projects/${projectId}/sign-offs`, { variantId: (created.json as { id: string }).id });
  expect(submitted.status).toBe(201);
  const signOffId = (submitted.json as { id: string }).id;
  await signOut(page);

  await signIn(page, baseUrl, 'owner@demo.stillspan.test');
  await openFootbridge(page, baseUrl);
  expect((await api(page, 'POST', `/api/projects/${projectId}/sign-offs/${signOffId}/approve`, { comment: 'For the workshop (e2e).' })).status).toBe(200);
  await signOut(page);
  return { projectId, signOffId };
}
