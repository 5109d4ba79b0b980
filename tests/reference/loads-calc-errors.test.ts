/**
 * The `calc` command for the design commands: the same JSON as the compute API, exit 2 with a JSON error naming
 * the field on bad input (the contract of the calc command). The expected figures are those of the closed-form
 * crowd resonance (Sétra 2006 n' with ψ = 1), evaluated by hand.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const dir = mkdtempSync(join(tmpdir(), 'stillspan-calc-'));
function calc(command: string, body: unknown) {
  const file = join(dir, `${command}-${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(file, JSON.stringify(body));
  return spawnSync(process.execPath, ['server/cli/calc.mjs', command, file], { encoding: 'utf8' });
}

const structure = { modalMassKg: 60000, frequencyHz: 1.9, dampingRatio: 0.006, direction: 'vertical' };
const crowd = { kind: 'crowd', guide: 'setra', densityPerM2: 0.5, deckAreaM2: 300 };

describe('calc assess / size / robustness', () => {
  it('assess answers the closed-form crowd resonance', () => {
    const run = calc('assess', { structure, tmds: [], loadCase: crowd, criteria: { set: 'en1990', class: 'normal-use' } });
    expect(run.status).toBe(0);
    const answer = JSON.parse(run.stdout);
    const closed = (280 * 10.8 * Math.sqrt(0.006 * 150) * (2 / Math.PI)) / (2 * 0.006 * 60000);
    expect(answer.peakAccelerationMPerS2 / closed).toBeCloseTo(1, 4);
    expect(answer.criterion.set).toBe('en1990');
    expect(answer.criterion.limitMPerS2).toBe(0.7);
    expect(answer.verdict).toBe('fail');
  }, 30_000);

  it('size and robustness answer', () => {
    const size = calc('size', { structure, method: 'den-hartog', loadCase: crowd, peakAccelerationLimitMPerS2: 0.7, structureFrequencyToleranceRatio: 0.05 });
    expect(size.status).toBe(0);
    expect(JSON.parse(size.stdout).worstPeakAccelerationMPerS2).toBeLessThanOrEqual(0.7);
    const map = calc('robustness', { structure, tmds: [{ massKg: 1200, frequencyHz: 1.86, dampingRatio: 0.08 }], loadCase: crowd, structureFrequencyFactors: [0.9, 1, 1.1], tmdDampingFactors: [1] });
    expect(map.status).toBe(0);
    expect(JSON.parse(map.stdout).peakAccelerationMPerS2).toHaveLength(3);
  }, 30_000);

  it('exits 2 with a JSON error naming the field (schema rule and a rule only the maths finds)', () => {
    const bad = calc('assess', { structure: { ...structure, frequencyHz: 'fast' }, tmds: [], loadCase: crowd });
    expect(bad.status).toBe(2);
    const last = bad.stderr.trim().split('\n').at(-1) as string;
    const error = JSON.parse(last).error;
    expect(error.issues[0].path).toBe('structure.frequencyHz');
    const impossible = calc('size', { structure, method: 'den-hartog', loadCase: crowd, peakAccelerationLimitMPerS2: 1e-5 });
    expect(impossible.status).toBe(2);
    const issues = JSON.parse(impossible.stderr.trim().split('\n').at(-1) as string).error.issues;
    expect(issues[0].path).toBe('peakAccelerationLimitMPerS2');
  }, 30_000);

  it('a structure damping ratio of 0: null for the unbounded bare peak in the JSON; a crowd below 1 P/m² refused', () => {
    // Den Hartog (Mechanical Vibrations, 1956) damper on an undamped mode, μ = 0.05: f = 1/(1+μ), ζ_a = √(3μ/(8(1+μ))).
    const undamped = { ...structure, dampingRatio: 0 };
    const tmd = { massKg: 3000, frequencyHz: 1.9 / 1.05, dampingRatio: Math.sqrt((3 * 0.05) / (8 * 1.05)) };
    const run = calc('assess', { structure: undamped, tmds: [tmd], loadCase: { kind: 'harmonic', modalForceAmplitudeN: 300, pacingRangeHz: [1.5, 2.3] } });
    expect(run.status).toBe(0);
    const answer = JSON.parse(run.stdout);
    expect(answer.bareStructurePeakAccelerationMPerS2).toBeNull();
    expect(answer.bareStructureAtFrequencyHz).toBe(1.9);
    expect(answer.warnings.map((w: { code: string }) => w.code)).toContain('bare-structure-unbounded');
    expect(Number.isFinite(answer.peakAccelerationMPerS2)).toBe(true);
    // Sétra 2006 / HiVoSS 2008: below 1 P/m² n' = 10.8 √(ζ n) needs the structure's damping ratio.
    const refused = calc('assess', { structure: undamped, tmds: [tmd], loadCase: crowd });
    expect(refused.status).toBe(2);
    const error = JSON.parse(refused.stderr.trim().split('\n').at(-1) as string).error;
    expect(error.issues[0].path).toBe('structure.dampingRatio');
    expect(error.issues[0].message).toMatch(/10\.8 √\(ζ n\)/);
  }, 30_000);

  it('the second harmonic: a harmonic other than 1 or 2 and a Sétra class outside II and I are refused by field', () => {
    const wrong = calc('assess', { structure, tmds: [], loadCase: { ...crowd, harmonic: 3 } });
    expect(wrong.status).toBe(2);
    const wrongIssue = JSON.parse(wrong.stderr.trim().split('\n').at(-1) as string).error.issues[0];
    expect(wrongIssue.path).toBe('loadCase.harmonic');
    // Sétra 2006 applies its second-harmonic case 3 to traffic classes II and I only.
    const classIII = calc('assess', { structure: { ...structure, frequencyHz: 3.8 }, tmds: [], loadCase: { kind: 'crowd', guide: 'setra', trafficClass: 'III', deckAreaM2: 300, harmonic: 2 } });
    expect(classIII.status).toBe(2);
    const issue = JSON.parse(classIII.stderr.trim().split('\n').at(-1) as string).error.issues[0];
    expect(issue.path).toBe('loadCase.trafficClass');
    expect(issue.message).toMatch(/classes II and I only/);
  }, 30_000);
});
