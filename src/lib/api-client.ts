import type { z } from 'zod';
import { apiErrorSchema, type ApiIssue } from '../../shared/contracts';

/** An error answered by the API in its one error shape, or a network / contract failure dressed the same way. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly issues: ApiIssue[];

  constructor(status: number, code: string, message: string, issues: ApiIssue[] = []) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.issues = issues;
  }

  get isUnauthenticated(): boolean {
    return this.status === 401;
  }
  get isForbidden(): boolean {
    return this.status === 403;
  }
  get isNotFound(): boolean {
    return this.status === 404;
  }
  get isConflict(): boolean {
    return this.status === 409;
  }
  /** A 4xx answer: the request itself was refused, so sending it again unchanged cannot succeed. */
  get isClientError(): boolean {
    return this.status >= 400 && this.status < 500;
  }
}

/** The error of a request that got no answer at all (status 0). */
export function networkError(): ApiError {
  return new ApiError(0, 'network', 'The server could not be reached. Check your connection and try again.');
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

export interface RequestOptions<T> {
  method?: Method;
  body?: unknown;
  /** The contract schema of the answer; the answer is parsed with it so a drifting server is caught here. */
  schema?: z.ZodType<T>;
  signal?: AbortSignal;
}

/** Calls the JSON API on the same origin with the session cookie and returns the parsed answer. */
export async function apiRequest<T = void>(path: string, options: RequestOptions<T> = {}): Promise<T> {
  const { method = 'GET', body, schema, signal } = options;
  let response: Response;
  try {
    response = await fetch(path, {
      method,
      credentials: 'same-origin',
      headers: {
        Accept: 'application/json',
        ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
      },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw networkError();
  }

  const text = await response.text();
  let payload: unknown = undefined;
  if (text) {
    try {
      payload = JSON.parse(text);
    } catch {
      payload = undefined;
    }
  }

  if (!response.ok) {
    const parsed = apiErrorSchema.safeParse(payload);
    if (parsed.success) {
      const { code, message, issues } = parsed.data.error;
      throw new ApiError(response.status, code, message, issues);
    }
    throw new ApiError(response.status, `http_${response.status}`, `The server answered ${response.status} ${response.statusText}.`);
  }

  if (!schema) return undefined as T;
  const parsed = schema.safeParse(payload);
  if (!parsed.success) {
    throw new ApiError(response.status, 'unexpected_response', `The server's answer to ${method} ${path} did not have the expected shape.`);
  }
  return parsed.data;
}

/** Issues whose path is the given field (or lies below it), for showing under a form field. */
export function issuesFor(error: unknown, field: string): ApiIssue[] {
  if (!isApiError(error)) return [];
  return error.issues.filter((issue) => issue.path === field || issue.path.startsWith(`${field}.`));
}

/** An issue's message without the path the server puts in front of it ("name: is required" → "is required"). */
export function issueMessage(issue: ApiIssue): string {
  return issue.path && issue.message.startsWith(`${issue.path}: `) ? issue.message.slice(issue.path.length + 2) : issue.message;
}

/** A sentence for a person, from any error a query or mutation may throw. */
export function describeError(error: unknown): string {
  if (isApiError(error)) return error.message;
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}
