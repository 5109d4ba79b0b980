import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { toApiIssues } from './errors';
import {
  MAX_FREQUENCY_HZ,
  MAX_MASS_KG,
  MIN_FREQUENCY_HZ,
  MIN_MASS_KG,
  directionSchema,
  structureModeSchema,
  tmdSchema,
} from './compute-shapes';
import * as compute from './compute';
import * as design from './compute-design';
import { joinPath, prefixIssues, prefixMessage } from './paths';

function issuesOf(schema: z.ZodType, value: unknown) {
  const parsed = schema.safeParse(value);
  return parsed.success ? [] : toApiIssues(parsed.error);
}

const mode = { modalMassKg: 40_000, frequencyHz: 2, dampingRatio: 0.005 };

describe('one schema per engine shape', () => {
  it('the compute and design contracts export the same mode, damper, direction and tuning method schemas', () => {
    expect(design.designStructureSchema).toBe(structureModeSchema);
    expect(compute.structureModeSchema).toBe(structureModeSchema);
    expect(design.designTmdSchema).toBe(tmdSchema);
    expect(compute.tmdSchema).toBe(tmdSchema);
    expect(design.directionSchema).toBe(directionSchema);
    expect(design.tuningMethodSchema).toBe(compute.tuningMethodSchema);
  });

  it('directions are one list with torsional in it; the default is vertical', () => {
    expect(directionSchema.options).toEqual(['vertical', 'lateral', 'longitudinal', 'torsional']);
    expect(structureModeSchema.parse({ ...mode, direction: 'torsional' }).direction).toBe('torsional');
    expect(structureModeSchema.parse(mode).direction).toBe('vertical');
    const [issue] = issuesOf(structureModeSchema, { ...mode, direction: 'diagonal' });
    expect(issue.path).toBe('direction');
    expect(issue.message).toMatch(/"vertical", "lateral", "longitudinal" or "torsional"/);
  });

  it('a mode and a damper report the field inside themselves', () => {
    expect(issuesOf(structureModeSchema, { ...mode, dampingRatio: 1 })[0]).toEqual({
      path: 'dampingRatio',
      message: 'dampingRatio: must be a damping ratio in [0, 1): less than 1',
    });
    expect(issuesOf(tmdSchema, { massKg: 0, frequencyHz: 2, dampingRatio: 0.1 })[0].path).toBe('massKg');
  });
});

describe('physical ranges of a mode and a damper (refused naming the field and the range)', () => {
  const cases: Array<[string, z.ZodType, unknown, string, RegExp]> = [
    ['a 1e-300 kg modal mass', structureModeSchema, { ...mode, modalMassKg: 1e-300 }, 'modalMassKg', /between 0\.001 and 1e12 kg \(a modal mass\)/],
    ['a 1e300 kg modal mass', structureModeSchema, { ...mode, modalMassKg: 1e300 }, 'modalMassKg', /between 0\.001 and 1e12 kg/],
    ['a 1e-9 Hz natural frequency', structureModeSchema, { ...mode, frequencyHz: 1e-9 }, 'frequencyHz', /between 0\.01 and 1000 Hz \(a natural frequency\)/],
    ['a 1e6 Hz natural frequency', structureModeSchema, { ...mode, frequencyHz: 1e6 }, 'frequencyHz', /between 0\.01 and 1000 Hz/],
    ['a 1e300 kg damper', tmdSchema, { massKg: 1e300, frequencyHz: 2, dampingRatio: 0.1 }, 'massKg', /between 0\.001 and 1e12 kg \(a damper mass\)/],
    ['a 1e5 Hz damper', tmdSchema, { massKg: 100, frequencyHz: 1e5, dampingRatio: 0.1 }, 'frequencyHz', /between 0\.01 and 1000 Hz/],
  ];
  for (const [what, schema, value, path, rule] of cases) {
    it(`refuses ${what}`, () => {
      const issue = issuesOf(schema, value).find((i) => i.path === path);
      expect(issue, JSON.stringify(issuesOf(schema, value))).toBeDefined();
      expect(issue!.message).toMatch(rule);
    });
  }

  it('accepts the ends of the ranges', () => {
    expect(structureModeSchema.safeParse({ ...mode, modalMassKg: MIN_MASS_KG, frequencyHz: MIN_FREQUENCY_HZ }).success).toBe(true);
    expect(structureModeSchema.safeParse({ ...mode, modalMassKg: MAX_MASS_KG, frequencyHz: MAX_FREQUENCY_HZ }).success).toBe(true);
  });

  it('a sign error still reads "greater than 0" alone, not the range as well', () => {
    const issues = issuesOf(structureModeSchema, { ...mode, modalMassKg: -1 });
    expect(issues).toHaveLength(1);
    expect(issues[0].message).toMatch(/greater than 0/);
  });
});

describe('path prefixing', () => {
  it('joins paths, leaving out empty parts', () => {
    expect(joinPath('structure', 'dampingRatio')).toBe('structure.dampingRatio');
    expect(joinPath('tmds', 0, 'massKg')).toBe('tmds.0.massKg');
    expect(joinPath('', 'dampingRatio')).toBe('dampingRatio');
    expect(joinPath('structure', '')).toBe('structure');
  });

  it('puts the prefix in front of the path a message starts with, or the whole path in front of a bare rule', () => {
    expect(prefixMessage('structure', 'dampingRatio', 'dampingRatio: must be a damping ratio in [0, 1)')).toBe('structure.dampingRatio: must be a damping ratio in [0, 1)');
    expect(prefixMessage('modes.2', 'timesS.3', 'timesS: entry 3 must be a finite number')).toBe('modes.2.timesS: entry 3 must be a finite number');
    expect(prefixMessage('structure', 'dampingRatio', 'is 0 and no damper is attached')).toBe('structure.dampingRatio: is 0 and no damper is attached');
    // A message that merely begins with the same letters is not taken for the path.
    expect(prefixMessage('mode', 'mass', 'massive input')).toBe('mode.mass: massive input');
    expect(prefixMessage('', 'dampingRatio', 'dampingRatio: x')).toBe('dampingRatio: x');
  });

  it('prefixes the issues of a stored mode checked by the engine schema', () => {
    const issues = issuesOf(structureModeSchema, { ...mode, dampingRatio: -0.1 });
    expect(prefixIssues('modes.1', issues)).toEqual([
      { path: 'modes.1.dampingRatio', message: 'modes.1.dampingRatio: must be a damping ratio in [0, 1): 0 or greater' },
    ]);
  });
});
