/**
 * As-built comparison against hand formulas:
 *   f = (1/2π) √(k/m) — undamped natural frequency of a single-degree-of-freedom oscillator (Chopra, "Dynamics of
 *   Structures", ch. 2, from memory; Den Hartog, "Mechanical Vibrations", 1956);
 *   at constant mass k ∝ f², at constant springs m ∝ 1/f² (the same relation solved for k or m);
 *   deviation = measured − design, % of design; mass ratio μ = m / M (PRODUCT conventions).
 * The design numbers must be the hardware sheet's own (shared/compute/hardware-sheet.ts). The damper is an invented
 * test input: 1000 kg at f_a = 2.0 Hz in 4 units, ±10 % tuning range, on a mode of 40 000 kg.
 */
import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { buildHardwareEntry } from '../engine/hardware';
import type { SignOffSnapshot } from '../contracts/sign-offs';
import { asBuiltInputSchema, asBuiltInputSchemaFor } from '../contracts/as-built';
import { toApiIssues } from '../contracts/errors';
import { buildHardwareSheet } from './hardware-sheet';
import { asBuiltDesignFromEntry, asBuiltDesignOf, compareAsBuilt, impliedFrequencyHz } from './as-built';

const twoPi = 2 * Math.PI;
const totalMassKg = 1000;
const fA = 2.0;
const units = 4;
const modalMassKg = 40_000;
const entry = buildHardwareEntry({ massKg: totalMassKg, frequencyHz: fA, dampingRatio: 0.07 }, 0.01, { unitCount: units, springsPerUnit: 2, tuningRangeRatio: 0.1 });
const design = asBuiltDesignFromEntry(entry, modalMassKg);

// Hand values of one unit.
const mUnit = totalMassKg / units; // 250 kg
const kUnit = mUnit * (twoPi * fA) ** 2; // k = m ω²
const close = (actual: number, expected: number, relative = 1e-12) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(relative * Math.abs(expected));

describe('implied frequency f = (1/2π) √(k/m)', () => {
  it('is 1 Hz for 1 kg on 4π² N/m and 2 Hz for the design unit (hand formula, Chopra ch. 2, from memory)', () => {
    close(impliedFrequencyHz(1, 4 * Math.PI ** 2), 1);
    close(impliedFrequencyHz(mUnit, kUnit), fA);
    // Four times the stiffness doubles the frequency; four times the mass halves it.
    close(impliedFrequencyHz(mUnit, 4 * kUnit), 2 * fA);
    close(impliedFrequencyHz(4 * mUnit, kUnit), fA / 2);
  });

  it('refuses a mass or spring rate that is not positive and finite', () => {
    expect(() => impliedFrequencyHz(0, 1)).toThrow(RangeError);
    expect(() => impliedFrequencyHz(1, -1)).toThrow(/springRateNPerM/);
    expect(() => impliedFrequencyHz(Number.NaN, 1)).toThrow(/movingMassKg/);
  });
});

describe('design numbers of the approved damper', () => {
  it('are the per-unit values and the tuning range of the hardware sheet, to the last digit', () => {
    const snapshot = {
      variant: { name: 'Test', massRatio: totalMassKg / modalMassKg, result: { loadCases: [{ name: 'Test crowd', hardware: [entry] }] } },
      mode: { label: 'Test mode', direction: 'vertical', frequencyHz: 2.05, modalMassKg },
      engineVersion: 'test',
    } as unknown as SignOffSnapshot;
    const sheet = buildHardwareSheet({
      projectName: 'Test',
      signOff: { id: '0123456789abcdef', status: 'approved', decidedAt: '2026-12-02T10:00:00.000Z', decisionComment: null, snapshot },
      approver: null,
    });
    const row = (quantity: string) => sheet.rows.find((r) => r.quantity === quantity)?.value;
    const d = asBuiltDesignOf(snapshot);
    expect(d.unitCount).toBe(row('Number of units'));
    expect(d.movingMassPerUnitKg).toBe(row('Moving mass per unit'));
    expect(d.springRatePerUnitNPerM).toBe(row('Spring rate per unit'));
    expect(d.frequencyHz).toBe(row('Target frequency'));
    expect(d.frequencyLowHz).toBe(row('Frequency, low end'));
    expect(d.frequencyHighHz).toBe(row('Frequency, high end'));
    expect(d.springRatePerUnitLowNPerM).toBe(row('Spring rate per unit at constant mass, low end'));
    expect(d.springRatePerUnitHighNPerM).toBe(row('Spring rate per unit at constant mass, high end'));
    expect(d.movingMassPerUnitLowKg).toBe(row('Moving mass per unit at constant springs, for the high end'));
    expect(d.movingMassPerUnitHighKg).toBe(row('Moving mass per unit at constant springs, for the low end'));
  });

  it('give the tuning range by k ∝ f² at constant mass and m ∝ 1/f² at constant springs (hand formulas)', () => {
    close(design.movingMassPerUnitKg, mUnit);
    close(design.springRatePerUnitNPerM, kUnit);
    close(design.frequencyLowHz, 0.9 * fA);
    close(design.frequencyHighHz, 1.1 * fA);
    close(design.springRatePerUnitLowNPerM, kUnit * 0.9 ** 2);
    close(design.springRatePerUnitHighNPerM, kUnit * 1.1 ** 2);
    close(design.movingMassPerUnitLowKg, mUnit / 1.1 ** 2);
    close(design.movingMassPerUnitHighKg, mUnit / 0.9 ** 2);
  });
});

describe('as-built comparison', () => {
  it('finds no deviation and no warning for units built exactly as designed', () => {
    const result = compareAsBuilt(
      design,
      [1, 2, 3, 4].map((unitNumber) => ({ unitNumber, movingMassKg: mUnit, springRateNPerM: kUnit, frequencyHz: fA })),
    );
    expect(result.warnings).toEqual([]);
    expect(result.unitsOutsideRange).toEqual([]);
    for (const unit of result.units) {
      expect(unit.withinTuningRange).toBe(true);
      close(unit.movingMassKg.absolute + mUnit, mUnit);
      expect(unit.movingMassKg.percent).toBeCloseTo(0, 12);
      close(unit.impliedFrequencyHz!.measuredValue, fA);
      expect(unit.frequencyRange?.verdict).toBe('inside');
    }
    // μ = Σ m / M (PRODUCT conventions): 1000 / 40 000 = 2.5 %.
    close(result.builtMassRatio!, 0.025);
    close(result.design.massRatio, 0.025);
  });

  it('gives each deviation absolutely and in % of the design, and the implied frequency by f = (1/2π) √(k/m)', () => {
    const m = 262.5; // +5 %
    const k = kUnit * 0.98; // −2 %
    const f = 1.95;
    const [unit] = compareAsBuilt(design, [{ unitNumber: 3, movingMassKg: m, springRateNPerM: k, frequencyHz: f }]).units;
    close(unit.movingMassKg.absolute, 12.5, 1e-9);
    close(unit.movingMassKg.percent, 5, 1e-9);
    close(unit.springRateNPerM!.percent, -2, 1e-9);
    close(unit.frequencyHz!.absolute, -0.05, 1e-9);
    close(unit.frequencyHz!.percent, -2.5, 1e-9);
    const fImplied = Math.sqrt(k / m) / twoPi; // hand formula
    close(unit.impliedFrequencyHz!.measuredValue, fImplied);
    // By the ratios alone: f / f_a = √(0.98 / 1.05).
    close(unit.impliedFrequencyHz!.measuredValue / fA, Math.sqrt(0.98 / 1.05), 1e-12);
    expect(unit.warnings).toEqual([]);
  });

  it('warns in plain words, with the remedy, when a measured frequency is above the tuning range', () => {
    const result = compareAsBuilt(design, [
      { unitNumber: 1, movingMassKg: mUnit },
      { unitNumber: 2, movingMassKg: mUnit, frequencyHz: 2.31 },
    ]);
    expect(result.unitsOutsideRange).toEqual([2]);
    expect(result.units[1].frequencyRange).toEqual({ low: 0.9 * fA, high: 1.1 * fA, verdict: 'above' });
    expect(result.warnings).toEqual(['Unit 2: measured 2.31 Hz is above the tuning range 1.8–2.2 Hz; add mass or soften the springs']);
  });

  it('warns when the frequency implied by a heavy unit on soft springs is below the range, and when the mass is outside the range at the design springs', () => {
    // m = 1.3 m_design is above m_design / 0.9² = 1.2346 m_design (m ∝ 1/f² at constant springs).
    const [unit] = compareAsBuilt(design, [{ unitNumber: 4, movingMassKg: 1.3 * mUnit, springRateNPerM: kUnit }]).units;
    expect(unit.massRange.verdict).toBe('above');
    // f = f_a / √1.3 = 1.754 Hz < 1.8 Hz.
    close(unit.impliedFrequencyHz!.measuredValue, fA / Math.sqrt(1.3));
    expect(unit.impliedFrequencyRange?.verdict).toBe('below');
    expect(unit.warnings).toEqual([
      'Unit 4: the frequency implied by the measured mass and spring rate, 1.75 Hz, is below the tuning range 1.8–2.2 Hz; remove mass or stiffen the springs',
      'Unit 4: moving mass 325 kg is above 207–309 kg, the range the design springs can tune; remove mass blocks or stiffen the springs',
    ]);
  });

  it('checks the spring rate against the range at the design mass (k ∝ f²), and says when the measured mass makes up for it', () => {
    // k = 1.25 k_design is above 1.1² k_design = 1.21 k_design; with m = 1.25 m_design the implied frequency is f_a.
    const [unit] = compareAsBuilt(design, [{ unitNumber: 1, movingMassKg: 1.25 * mUnit, springRateNPerM: 1.25 * kUnit }]).units;
    expect(unit.springRateRange?.verdict).toBe('above');
    // and m = 1.25 m_design is above m_design / 0.9² = 1.2346 m_design.
    expect(unit.massRange.verdict).toBe('above');
    expect(unit.impliedFrequencyRange?.verdict).toBe('inside');
    close(unit.impliedFrequencyHz!.measuredValue, fA);
    expect(unit.warnings.some((w) => w.startsWith('Unit 1: spring rate') && w.includes('soften the springs or add mass') && w.includes('implied frequency is inside'))).toBe(true);
  });

  it('tells a value from the range end it is compared with by adding digits', () => {
    const [unit] = compareAsBuilt(design, [{ unitNumber: 1, movingMassKg: mUnit, frequencyHz: 2.2004 }]).units;
    expect(unit.warnings).toEqual(['Unit 1: measured 2.2004 Hz is above the tuning range 1.8–2.2 Hz; add mass or soften the springs']);
  });

  it('keeps a range end inside the range', () => {
    const [unit] = compareAsBuilt(design, [{ unitNumber: 1, movingMassKg: design.movingMassPerUnitHighKg, frequencyHz: design.frequencyLowHz }]).units;
    expect(unit.massRange.verdict).toBe('inside');
    expect(unit.frequencyRange?.verdict).toBe('inside');
  });

  it('totals the recorded units, and gives the mass ratio built only when every unit is recorded', () => {
    const partial = compareAsBuilt(design, [
      { unitNumber: 1, movingMassKg: 240 },
      { unitNumber: 2, movingMassKg: 270 },
    ]);
    expect(partial.recordedUnitCount).toBe(2);
    close(partial.recordedMovingMassKg.measuredValue, 510);
    close(partial.recordedMovingMassKg.designValue, 500);
    close(partial.recordedMovingMassKg.percent, 2, 1e-9);
    expect(partial.builtMassRatio).toBeNull();
    const whole = compareAsBuilt(design, [240, 270, 250, 260].map((movingMassKg, i) => ({ unitNumber: i + 1, movingMassKg })));
    close(whole.builtMassRatio!, 1020 / modalMassKg); // μ = Σ m / M
  });

  it('warns when the mass ratio built is outside the usual 0.5–10 % (PRODUCT cautions)', () => {
    const light = asBuiltDesignFromEntry(buildHardwareEntry({ massKg: 100, frequencyHz: fA, dampingRatio: 0.05 }, 0.01, { unitCount: 1 }), modalMassKg);
    const result = compareAsBuilt(light, [{ unitNumber: 1, movingMassKg: 100 }]);
    close(result.builtMassRatio!, 0.0025);
    expect(result.warnings).toEqual(['The mass ratio built, 0.25 %, is outside the usual 0.5–10 % of the modal mass; have the design checked for this damper']);
  });

  it('refuses units numbered outside the sheet or listed twice', () => {
    expect(() => compareAsBuilt(design, [{ unitNumber: 5, movingMassKg: 1 }])).toThrow(/1\.\.4/);
    expect(() => compareAsBuilt(design, [{ unitNumber: 1, movingMassKg: 1 }, { unitNumber: 1, movingMassKg: 2 }])).toThrow(/twice/);
    expect(() => compareAsBuilt(design, [])).toThrow(RangeError);
    expect(() => compareAsBuilt({ ...design, frequencyLowHz: Number.NaN }, [{ unitNumber: 1, movingMassKg: 1 }])).toThrow(/frequencyLowHz/);
  });
});

describe('as-built request body', () => {
  const issues = (schema: { parse: (v: unknown) => unknown }, body: unknown) => {
    try {
      schema.parse(body);
    } catch (error) {
      if (error instanceof ZodError) return toApiIssues(error);
      throw error;
    }
    return [];
  };

  it('names the field path and the rule of every bad value', () => {
    const found = issues(asBuiltInputSchema, {
      units: [
        { unitNumber: 1, movingMassKg: 250 },
        { unitNumber: 2, movingMassKg: -3, springRateNPerM: 0, frequencyHz: 500, measuredAt: '30.11.2026', colour: 'red' },
      ],
    });
    expect(found.map((i) => i.path).sort()).toEqual(
      ['units.1.colour', 'units.1.frequencyHz', 'units.1.measuredAt', 'units.1.movingMassKg', 'units.1.springRateNPerM'].sort(),
    );
    expect(found.find((i) => i.path === 'units.1.movingMassKg')?.message).toBe('units.1.movingMassKg: must be between 0.1 and 1000000 kg');
    expect(found.find((i) => i.path === 'units.1.frequencyHz')?.message).toBe('units.1.frequencyHz: must be between 0.01 and 100 Hz');
  });

  it('wants at least one unit, each once, numbered within the sheet', () => {
    expect(issues(asBuiltInputSchema, { units: [] })[0]).toEqual({ path: 'units', message: 'units: must list at least one unit' });
    expect(issues(asBuiltInputSchema, {})[0]).toEqual({ path: 'units', message: 'units: is required' });
    const body = { units: [{ unitNumber: 2, movingMassKg: 250 }, { unitNumber: 5, movingMassKg: 250 }, { unitNumber: 2, movingMassKg: 251 }] };
    expect(issues(asBuiltInputSchemaFor(4), body)).toEqual([
      { path: 'units.1.unitNumber', message: 'units.1.unitNumber: must be between 1 and 4: the hardware sheet has 4 units' },
      { path: 'units.2.unitNumber', message: 'units.2.unitNumber: repeats unit 2 (already given at units.0); each unit once per record' },
    ]);
    expect(issues(asBuiltInputSchema, { units: [{ unitNumber: 0, movingMassKg: 250 }] })[0].path).toBe('units.0.unitNumber');
    expect(asBuiltInputSchemaFor(4).parse({ units: [{ unitNumber: 4, movingMassKg: 250, measuredAt: '2026-11-30', note: ' shimmed ' }] }).units[0].note).toBe('shimmed');
  });
});
