/**
 * Field paths of bad input, dotted (`structure.dampingRatio`, `tmds.0.massKg`). Every check reports the path inside
 * its own input (the check of a mode says `dampingRatio`); whoever holds that input puts its own place in front
 * (`structure.` in a compute command, the field of a stored mode in a form), so one check serves every caller.
 */
import { EngineInputError, checkDampingRatio, checkPositive } from './linalg';
import type { StructureMode, TmdParameters } from './types';

/** Joins path parts with dots, leaving out empty parts: joinPath('structure', 'dampingRatio') = 'structure.dampingRatio'. */
export function joinPath(...parts: ReadonlyArray<string | number>): string {
  return parts
    .map(String)
    .filter((part) => part !== '')
    .join('.');
}

/**
 * The message of an error at `path`, moved under `prefix`: a message that starts with the path's first part
 * (`dampingRatio: must be …`, `timesS: entry 3 …`) gets the prefix in front of it; any other message gets the whole
 * prefixed path in front (`structure.dampingRatio: the rule`).
 */
export function prefixMessage(prefix: string, path: string, message: string): string {
  if (prefix === '') return message;
  const head = path.split('.')[0];
  if (head !== '' && message.startsWith(head) && /^[\s:.]/.test(message.slice(head.length))) return `${prefix}.${message}`;
  if (path === '' && message.startsWith(prefix)) return message;
  return `${joinPath(prefix, path)}: ${message}`;
}

/** The same engine input error with `prefix` in front of its field and of the field its message names; other errors unchanged. */
export function prefixEngineInputError(prefix: string, error: unknown): unknown {
  if (!(error instanceof EngineInputError) || prefix === '') return error;
  return new EngineInputError(joinPath(prefix, error.field), prefixMessage(prefix, error.field, error.message));
}

/** Runs a check (or any engine code) and re-throws its input errors with `prefix` in front of their paths. */
export function withPathPrefix<T>(prefix: string, run: () => T): T {
  try {
    return run();
  } catch (error) {
    throw prefixEngineInputError(prefix, error);
  }
}

/** Checks one structure mode; errors name the field inside the mode (`modalMassKg`, `frequencyHz`, `dampingRatio`). */
export function checkStructureMode(mode: StructureMode): void {
  if (mode === null || typeof mode !== 'object') throw new TypeError('must be an object { modalMassKg, frequencyHz, dampingRatio }');
  checkPositive(mode.modalMassKg, 'modalMassKg');
  checkPositive(mode.frequencyHz, 'frequencyHz');
  checkDampingRatio(mode.dampingRatio, 'dampingRatio');
}

/** Checks one tuned mass damper; errors name the field inside the damper (`massKg`, `frequencyHz`, `dampingRatio`). */
export function checkTmdParameters(tmd: TmdParameters): void {
  if (tmd === null || typeof tmd !== 'object') throw new TypeError('must be an object { massKg, frequencyHz, dampingRatio }');
  checkPositive(tmd.massKg, 'massKg');
  checkPositive(tmd.frequencyHz, 'frequencyHz');
  checkDampingRatio(tmd.dampingRatio, 'dampingRatio');
}
