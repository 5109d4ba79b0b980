/**
 * A test that logs console.error fails: every message is recorded and, after each test, reported as a failure.
 * (The server writes its own log lines to stderr directly; console.error comes only from something unexpected.)
 */
import { afterEach, beforeEach, expect } from 'vitest';

const original = console.error;
let logged: string[] = [];

beforeEach(() => {
  logged = [];
  console.error = (...args: unknown[]) => {
    logged.push(args.map((arg) => (arg instanceof Error ? arg.stack ?? arg.message : String(arg))).join(' '));
    original(...args);
  };
});

afterEach(() => {
  console.error = original;
  expect(logged, 'console.error was called during the test').toEqual([]);
});
