import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { toApiIssues } from '../../shared/contracts';
import { ApiError, apiRequest, describeError, issueMessage, issuesFor } from './api-client';

function answer(status: number, body: unknown, statusText = '') {
  return vi.fn(async () => new Response(typeof body === 'string' ? body : JSON.stringify(body), { status, statusText }));
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('apiRequest', () => {
  it('parses a successful answer with the contract schema', async () => {
    vi.stubGlobal('fetch', answer(200, { status: 'ok', extra: 1 }));
    await expect(apiRequest('/api/x', { schema: z.object({ status: z.literal('ok') }) })).resolves.toEqual({ status: 'ok' });
  });

  it('sends JSON bodies with the JSON content type and the session cookie', async () => {
    const fetchMock = answer(201, { id: 'a' });
    vi.stubGlobal('fetch', fetchMock);
    await apiRequest('/api/projects', { method: 'POST', body: { name: 'Footbridge' }, schema: z.object({ id: z.string() }) });
    const [, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(init.method).toBe('POST');
    expect(init.credentials).toBe('same-origin');
    expect((init.headers as Record<string, string>)['Content-Type']).toBe('application/json');
    expect(init.body).toBe('{"name":"Footbridge"}');
  });

  it('turns the API error shape into a typed ApiError with its issues', async () => {
    vi.stubGlobal(
      'fetch',
      answer(400, { error: { code: 'invalid_input', message: 'name: is required', issues: [{ path: 'name', message: 'name: is required' }] } }),
    );
    const error = await apiRequest('/api/projects', { method: 'POST', body: {} }).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: 'invalid_input', issues: [{ path: 'name' }] });
    expect(issuesFor(error, 'name')).toHaveLength(1);
    expect(issuesFor(error, 'kind')).toHaveLength(0);
  });

  it('names the status when the answer is not in the error shape', async () => {
    vi.stubGlobal('fetch', answer(502, '<html>Bad gateway</html>', 'Bad Gateway'));
    const error = await apiRequest('/api/projects').catch((caught: unknown) => caught);
    expect(error).toMatchObject({ status: 502, code: 'http_502' });
    expect(describeError(error)).toContain('502');
  });

  it('refuses an answer that does not match the contract', async () => {
    vi.stubGlobal('fetch', answer(200, { projects: 'none' }));
    const error = await apiRequest('/api/projects', { schema: z.object({ projects: z.array(z.string()) }) }).catch((caught: unknown) => caught);
    expect(error).toMatchObject({ code: 'unexpected_response' });
  });

  it('reports an unreachable server as a network error', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    await expect(apiRequest('/api/me')).rejects.toMatchObject({ status: 0, code: 'network' });
  });
});

describe('issueMessage', () => {
  it('drops the path the shared contracts put in front of a message', () => {
    const parsed = z.object({ name: z.string().min(1, 'is required') }).safeParse({ name: '' });
    if (parsed.success) throw new Error('expected a failure');
    const [issue] = toApiIssues(parsed.error);
    expect(issue.path).toBe('name');
    expect(issueMessage(issue)).toBe('is required');
  });

  it('keeps a message that carries no path', () => {
    expect(issueMessage({ path: '', message: 'Body must be JSON' })).toBe('Body must be JSON');
  });
});
