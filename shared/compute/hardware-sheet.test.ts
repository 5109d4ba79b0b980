/**
 * The hardware sheet's rows and CSV from an approved snapshot. The numbers are checked against the standard TMD
 * relations (Den Hartog 1956, "Mechanical Vibrations"; common practice for the hardware): k = m (2π f_a)²,
 * c = 2 ζ_a m ω_a, static deflection g / ω_a² with g = 9.80665 m/s². The CSV is read back with papaparse (RFC 4180).
 * The damper below is an invented test input.
 */
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { buildHardwareEntry } from '../engine/hardware';
import type { SignOffSnapshot } from '../contracts/sign-offs';
import { buildHardwareSheet, HardwareSheetUnavailableError, hardwareSheetCsv } from './hardware-sheet';

const tmd = { massKg: 600, frequencyHz: 1.9, dampingRatio: 0.08 };
const entry = buildHardwareEntry(tmd, 0.012, { unitCount: 3, springsPerUnit: 2, strokeLimitM: 0.05 });
const snapshot = {
  variant: { name: 'Test, "quoted" variant', massRatio: 0.02, result: { loadCases: [{ name: 'Test crowd', hardware: [entry] }] } },
  mode: { label: 'Test mode', direction: 'vertical', frequencyHz: 1.95, modalMassKg: 30_000 },
  engineVersion: 'test',
} as unknown as SignOffSnapshot;
const input = (status: string) => ({
  projectName: 'Test bridge, north\nspan',
  signOff: { id: '0123456789abcdef', status, decidedAt: '2026-12-02T10:00:00.000Z', decisionComment: 'Build "as drawn", please', snapshot },
  approver: { name: 'Test Owner', email: 'owner@example.test' },
});

describe('hardware sheet', () => {
  it('exists only for an approved sign-off', () => {
    expect(() => buildHardwareSheet(input('submitted'))).toThrow(HardwareSheetUnavailableError);
    expect(() => buildHardwareSheet(input('returned'))).toThrow(HardwareSheetUnavailableError);
  });

  it('gives per unit the standard TMD relations, and an RFC 4180 CSV that reads back', () => {
    const sheet = buildHardwareSheet(input('approved'));
    expect(sheet.revision).toBe('01234567-2026-12-02');
    const w = 2 * Math.PI * tmd.frequencyHz;
    const value = (q: string) => sheet.rows.find((r) => r.quantity === q)?.value as number;
    expect(value('Spring rate per unit')).toBeCloseTo((tmd.massKg * w * w) / 3, 6);
    expect(value('Spring rate per spring')).toBeCloseTo((tmd.massKg * w * w) / 6, 6);
    expect(value('Damper coefficient per unit')).toBeCloseTo((2 * tmd.dampingRatio * tmd.massKg * w) / 3, 6);
    expect(value('Static deflection under the moving mass')).toBeCloseTo((9.80665 / (w * w)) * 1000, 6);
    expect(value('Design stroke')).toBeCloseTo(1.5 * 12, 9);
    expect(value('Hardware travel')).toBeCloseTo(50, 9);

    const parsed = Papa.parse<string[]>(hardwareSheetCsv(sheet), { skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data[0]).toEqual(['section', 'quantity', 'value', 'unit', 'note']);
    expect(parsed.data.every((r) => r.length === 5)).toBe(true);
    expect(parsed.data.find((r) => r[1] === 'Project')?.[2]).toBe('Test bridge, north\nspan');
    expect(parsed.data.find((r) => r[1] === 'Comment')?.[2]).toBe('Build "as drawn", please');
    // Six significant figures in the file.
    expect(parsed.data.find((r) => r[1] === 'Spring rate per unit')?.[2]).toBe(String(Number(value('Spring rate per unit').toPrecision(6))));
  });
});
