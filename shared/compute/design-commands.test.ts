import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { designCommands } from './design-commands';
import { ComputeInputError } from './types';
import { toApiIssues } from '../contracts/errors';

const structure = { modalMassKg: 40000, frequencyHz: 2.0, dampingRatio: 0.005, direction: 'vertical' };
const tmds = [{ massKg: 800, frequencyHz: 1.96, dampingRatio: 0.08 }];
const crowd = { kind: 'crowd', guide: 'setra', densityPerM2: 0.5, deckAreaM2: 150 };

function issuesOf(command: string, body: unknown): { path: string; message: string }[] {
  const parsed = designCommands[command].request.safeParse(body);
  if (parsed.success) {
    try {
      designCommands[command].run(parsed.data);
    } catch (error) {
      if (error instanceof ComputeInputError) return error.issues;
      throw error;
    }
    return [];
  }
  return toApiIssues(parsed.error as z.ZodError);
}

describe('design commands', () => {
  it('registers assess, size and robustness and their answers match their schemas', () => {
    const a = designCommands.assess.run(designCommands.assess.request.parse({ structure, tmds, loadCase: crowd, criteria: { set: 'en1990', class: 'normal-use' } }));
    expect(designCommands.assess.response.safeParse(a).success).toBe(true);
    const s = designCommands.size.run(designCommands.size.request.parse({ structure, method: 'den-hartog', loadCase: crowd, peakAccelerationLimitMPerS2: 0.7, structureFrequencyToleranceRatio: 0.05 }));
    expect(designCommands.size.response.safeParse(s).success).toBe(true);
    const r = designCommands.robustness.run(designCommands.robustness.request.parse({ structure, tmds, loadCase: crowd, structureFrequencyFactors: [0.9, 1, 1.1], tmdDampingFactors: [0.5, 1] }));
    expect(designCommands.robustness.response.safeParse(r).success).toBe(true);
    expect(r.peakAccelerationMPerS2).toHaveLength(3);
    expect(r.peakAccelerationMPerS2[0]).toHaveLength(2);
  });

  it('every load case kind answers through assess with a schema-valid answer', () => {
    const lateral = { modalMassKg: 90000, frequencyHz: 0.95, dampingRatio: 0.008, direction: 'lateral' };
    const cases: Array<[Record<string, unknown>, Record<string, unknown>]> = [
      [structure, { kind: 'harmonic', modalForceAmplitudeN: 400, pacingRangeHz: [1.6, 2.4] }],
      [structure, { kind: 'walker' }],
      [structure, { kind: 'jogger', pacingRangeHz: [2.0, 3.0] }],
      [structure, { kind: 'crowd', guide: 'hivoss', trafficClass: 'TC1', deckAreaM2: 120 }],
      [lateral, { kind: 'lateral', guide: 'setra', trafficClass: 'II', deckAreaM2: 400 }],
      [{ ...structure, frequencyHz: 5.5, dampingRatio: 0.025 }, { kind: 'floor-walking', effectiveWeightN: 600000 }],
      [structure, { kind: 'moving-walker', spanM: 35 }],
    ];
    for (const [s, loadCase] of cases) {
      const request = designCommands.assess.request.parse({ structure: s, tmds, loadCase, criteria: { set: 'en1990', class: 'crowd' }, hardware: { unitCount: 2 } });
      const answer = designCommands.assess.run(request);
      const check = designCommands.assess.response.safeParse(answer);
      expect(check.success, `${String(loadCase.kind)}: ${check.success ? '' : check.error.message}`).toBe(true);
      expect(answer.peakAccelerationMPerS2).toBeGreaterThan(0);
      expect(answer.modalForceAmplitudeN).toBeGreaterThan(0);
      expect(answer.hardware[0].unitCount).toBe(2);
      expect(answer.criterion.set).toBe('en1990');
    }
  });

  it('defaults: direction vertical, no dampers, size tolerance 0', () => {
    const parsed = designCommands.assess.request.parse({ structure: { modalMassKg: 1, frequencyHz: 2, dampingRatio: 0.01 }, loadCase: crowd });
    expect(parsed.structure.direction).toBe('vertical');
    expect(parsed.tmds).toEqual([]);
    expect(designCommands.size.request.parse({ structure, method: 'hinf', loadCase: crowd, peakAccelerationLimitMPerS2: 1 }).structureFrequencyToleranceRatio).toBe(0);
  });

  describe('structure damping ratio 0', () => {
    const undamped = { ...structure, dampingRatio: 0 };
    const harmonic = { kind: 'harmonic', modalForceAmplitudeN: 300, pacingRangeHz: [1.6, 2.4] };
    /** Runs a command and returns its answer as the JSON text the API and `calc` send, parsed back. */
    const throughJson = (command: string, body: unknown) => {
      const answer = designCommands[command].run(designCommands[command].request.parse(body));
      const json = JSON.parse(JSON.stringify(answer)) as Record<string, unknown>;
      const check = designCommands[command].response.safeParse(json);
      expect(check.success, check.success ? '' : check.error.message).toBe(true);
      return json;
    };

    it('assess: the unbounded bare peak is null in the JSON, at the structure frequency, with a warning and a failing bare verdict', () => {
      const json = throughJson('assess', { structure: undamped, tmds, loadCase: harmonic, criteria: { set: 'en1990', class: 'normal-use' } });
      expect(json.bareStructurePeakAccelerationMPerS2).toBeNull();
      expect(json.bareStructureAtFrequencyHz).toBe(2.0);
      expect(json.bareStructureVerdict).toBe('fail');
      expect(json.bareStructureUtilisation).toBeNull();
      expect(typeof json.peakAccelerationMPerS2).toBe('number');
      const warning = (json.warnings as Array<{ code: string; message: string }>).find((w) => w.code === 'bare-structure-unbounded');
      expect(warning?.message).toMatch(/damping ratio of 0.*2\.000 Hz lies in the loaded band.*null/);
    });

    it('assess: the crowd is accepted from 1 person/m² (n\' = 1.85 √n, Sétra 2006 class I)', () => {
      const json = throughJson('assess', { structure: undamped, tmds, loadCase: { kind: 'crowd', guide: 'setra', trafficClass: 'I', deckAreaM2: 150 } });
      expect(json.equivalentPedestrians).toBeCloseTo(1.85 * Math.sqrt(150), 12);
      expect(json.bareStructurePeakAccelerationMPerS2).toBeNull();
    });

    it('size and robustness: null bare entries in the JSON, numbers elsewhere', () => {
      const s = throughJson('size', { structure: undamped, method: 'den-hartog', loadCase: harmonic, peakAccelerationLimitMPerS2: 0.5, structureFrequencyToleranceRatio: 0.05 });
      expect(s.bareStructureWorstPeakAccelerationMPerS2).toBeNull();
      expect(typeof s.massRatio).toBe('number');
      expect((s.massRatio as number) > 0).toBe(true);
      const r = throughJson('robustness', { structure: undamped, tmds, loadCase: harmonic, structureFrequencyFactors: [0.7, 1, 1.25], tmdDampingFactors: [0.5, 1] });
      // 0.7 × 2 = 1.4 Hz lies below the band and 1.25 × 2 = 2.5 Hz above it: finite; 2.0 Hz lies in it: null.
      expect(r.bareStructurePeakAccelerationMPerS2).toEqual([expect.any(Number), null, expect.any(Number)]);
      expect((r.peakAccelerationMPerS2 as number[][]).flat().every(Number.isFinite)).toBe(true);
    });

    it('assess, floor walking: the DG11 formula value is null; moving walker: the steady state is null', () => {
      const floor = throughJson('assess', { structure: { ...undamped, frequencyHz: 5.5 }, tmds: [{ massKg: 800, frequencyHz: 5.3, dampingRatio: 0.08 }], loadCase: { kind: 'floor-walking' } });
      expect((floor.dg11 as Record<string, unknown>).formulaPeakAccelerationMPerS2).toBeNull();
      const walker = throughJson('assess', { structure: undamped, loadCase: { kind: 'moving-walker', spanM: 30 } });
      expect((walker.timeHistory as Record<string, unknown>).steadyStatePeakAccelerationMPerS2).toBeNull();
      expect(typeof walker.bareStructurePeakAccelerationMPerS2).toBe('number');
    });
  });

  const bad: Array<[string, string, unknown, string, RegExp]> = [
    ['string for a number', 'assess', { structure: { ...structure, modalMassKg: '40000' }, tmds, loadCase: crowd }, 'structure.modalMassKg', /must be a number/],
    ['missing field', 'assess', { structure, tmds, loadCase: { kind: 'crowd', guide: 'setra', densityPerM2: 0.5 } }, 'loadCase.deckAreaM2', /is required/],
    // Structure damping ratio: [0, 1) like the engine's commands; 0 is refused only where it makes the load meaningless.
    ['a negative structure damping ratio', 'assess', { structure: { ...structure, dampingRatio: -0.01 }, tmds, loadCase: crowd }, 'structure.dampingRatio', /0 or greater/],
    ['a structure damping ratio of 1', 'size', { structure: { ...structure, dampingRatio: 1 }, method: 'hinf', loadCase: crowd, peakAccelerationLimitMPerS2: 0.5 }, 'structure.dampingRatio', /less than 1/],
    // Sétra 2006 / HiVoSS 2008: below 1 person/m² n' = 10.8 √(ζ n) needs the structure's own damping.
    ['zero damping of the structure under a crowd below 1 P/m² (Sétra)', 'assess', { structure: { ...structure, dampingRatio: 0 }, tmds, loadCase: crowd }, 'structure.dampingRatio', /n' = 10\.8 √\(ζ n\).*needs the structure's own damping.*1\.85 √n does not/],
    ['zero damping of the structure under HiVoSS TC1 (15 people)', 'assess', { structure: { ...structure, dampingRatio: 0 }, tmds, loadCase: { kind: 'crowd', guide: 'hivoss', trafficClass: 'TC1', deckAreaM2: 120 } }, 'structure.dampingRatio', /10\.8 √\(ζ n\)/],
    ['zero damping of the structure, lateral crowd of Sétra class II', 'assess', { structure: { modalMassKg: 90000, frequencyHz: 0.95, dampingRatio: 0, direction: 'lateral' }, tmds, loadCase: { kind: 'lateral', guide: 'setra', trafficClass: 'II', deckAreaM2: 400 } }, 'structure.dampingRatio', /10\.8 √\(ζ n\)/],
    ['zero damping of the structure under a crowd in size', 'size', { structure: { ...structure, dampingRatio: 0 }, method: 'den-hartog', loadCase: crowd, peakAccelerationLimitMPerS2: 0.5 }, 'structure.dampingRatio', /10\.8 √\(ζ n\)/],
    ['zero damping of the structure under a crowd in robustness', 'robustness', { structure: { ...structure, dampingRatio: 0 }, tmds, loadCase: crowd, structureFrequencyFactors: [1], tmdDampingFactors: [1] }, 'structure.dampingRatio', /10\.8 √\(ζ n\)/],
    // No damping anywhere and a resonance in the band: the steady state is unbounded.
    ['an undamped structure without dampers at resonance', 'assess', { structure: { ...structure, dampingRatio: 0 }, loadCase: { kind: 'harmonic', modalForceAmplitudeN: 100, pacingRangeHz: [1.6, 2.4] } }, 'structure.dampingRatio', /no damper is attached.*unbounded/],
    ['an undamped structure with an undamped damper', 'assess', { structure: { ...structure, dampingRatio: 0 }, tmds: [{ ...tmds[0], dampingRatio: 0 }], loadCase: { kind: 'harmonic', modalForceAmplitudeN: 100, pacingRangeHz: [1.6, 2.4] } }, 'tmds.0.dampingRatio', /coupled natural frequency .* Hz lies in the loaded band 1\.6–2\.4 Hz.*unbounded/],
    ['a damping factor of 0 on an undamped structure', 'robustness', { structure: { ...structure, dampingRatio: 0 }, tmds, loadCase: { kind: 'harmonic', modalForceAmplitudeN: 100, pacingRangeHz: [1.6, 2.4] }, structureFrequencyFactors: [1], tmdDampingFactors: [1, 0] }, 'tmdDampingFactors.1', /unbounded/],
    ['an undamped damper in robustness on an undamped structure', 'robustness', { structure: { ...structure, dampingRatio: 0 }, tmds: [{ ...tmds[0], dampingRatio: 0 }], loadCase: { kind: 'harmonic', modalForceAmplitudeN: 100, pacingRangeHz: [1.6, 2.4] }, structureFrequencyFactors: [1], tmdDampingFactors: [1] }, 'tmds.0.dampingRatio', /unbounded/],
    ['damper damping ratio of 1', 'assess', { structure, tmds: [{ ...tmds[0], dampingRatio: 1 }], loadCase: crowd }, 'tmds.0.dampingRatio', /less than 1/],
    ['negative damper mass', 'assess', { structure, tmds: [{ ...tmds[0], massKg: -5 }], loadCase: crowd }, 'tmds.0.massKg', /greater than 0/],
    ['unknown load kind', 'assess', { structure, tmds, loadCase: { kind: 'stampede' } }, 'loadCase.kind', /must have a "kind"/],
    ['unknown guide', 'assess', { structure, tmds, loadCase: { ...crowd, guide: 'other' } }, 'loadCase.guide', /"setra" or "hivoss"/],
    ['density and class both given', 'assess', { structure, tmds, loadCase: { ...crowd, trafficClass: 'II' } }, 'loadCase.densityPerM2', /exactly one/],
    ['traffic class of the other guide', 'assess', { structure, tmds, loadCase: { kind: 'crowd', guide: 'setra', trafficClass: 'TC2', deckAreaM2: 100 } }, 'loadCase.trafficClass', /I, II, III/],
    ['reversed pacing range', 'assess', { structure, tmds, loadCase: { kind: 'harmonic', modalForceAmplitudeN: 100, pacingRangeHz: [2.4, 1.6] } }, 'loadCase.pacingRangeHz', /must not exceed/],
    ['lateral case on a vertical mode', 'assess', { structure, tmds, loadCase: { ...crowd, kind: 'lateral' } }, 'structure.direction', /"lateral"/],
    ['jogger sideways', 'assess', { structure: { ...structure, direction: 'lateral' }, tmds, loadCase: { kind: 'jogger' } }, 'structure.direction', /"vertical"/],
    ['unknown criteria class', 'assess', { structure, tmds, loadCase: crowd, criteria: { set: 'hivoss', class: 'CL9' } }, 'criteria.class', /CL1/],
    ['DG11 limits on a lateral mode', 'assess', { structure: { ...structure, direction: 'lateral', frequencyHz: 0.9 }, tmds, loadCase: { ...crowd, kind: 'crowd' }, criteria: { set: 'dg11', class: 'office' } }, 'criteria.set', /vertical modes only/],
    ['misspelt field', 'assess', { structure, tmds, loadCase: { ...crowd, deckArea: 3 } }, 'loadCase.deckArea', /is not a known field/],
    ['unknown tuning method', 'size', { structure, method: 'guess', loadCase: crowd, peakAccelerationLimitMPerS2: 0.5 }, 'method', /den-hartog/],
    ['moving walker in size', 'size', { structure, method: 'hinf', loadCase: { kind: 'moving-walker', spanM: 30 }, peakAccelerationLimitMPerS2: 0.5 }, 'loadCase.kind', /must have a "kind"/],
    ['unreachable limit', 'size', { structure, method: 'den-hartog', loadCase: crowd, peakAccelerationLimitMPerS2: 1e-5 }, 'peakAccelerationLimitMPerS2', /no damper up to/],
    ['tolerance too wide', 'size', { structure, method: 'den-hartog', loadCase: crowd, peakAccelerationLimitMPerS2: 0.5, structureFrequencyToleranceRatio: 0.9 }, 'structureFrequencyToleranceRatio', /at most 0.5/],
    ['no damper in robustness', 'robustness', { structure, tmds: [], loadCase: crowd, structureFrequencyFactors: [1], tmdDampingFactors: [1] }, 'tmds', /one damper/],
    ['zero structure factor', 'robustness', { structure, tmds, loadCase: crowd, structureFrequencyFactors: [0, 1], tmdDampingFactors: [1] }, 'structureFrequencyFactors', /greater than 0/],
    ['damping factor reaching ζ = 1', 'robustness', { structure, tmds, loadCase: crowd, structureFrequencyFactors: [1], tmdDampingFactors: [1, 20] }, 'tmdDampingFactors.1', /reach 1/],
    ['moving walker too long to integrate', 'assess', { structure, tmds, loadCase: { kind: 'moving-walker', spanM: 1e6 } }, 'loadCase.spanM', /time steps/],
  ];
  for (const [what, command, body, path, message] of bad) {
    it(`refuses ${what}, naming ${path}`, () => {
      const issues = issuesOf(command, body);
      const hit = issues.find((i) => i.path === path);
      expect(hit, JSON.stringify(issues)).toBeDefined();
      expect(hit!.message).toMatch(message);
    });
  }
});
