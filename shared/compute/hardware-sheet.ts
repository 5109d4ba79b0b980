/**
 * The fabricator's hardware sheet of an approved sign-off: one pure function from the approved snapshot to rows
 * `{ section, quantity, value, unit, note }`, used by the CSV, the PDF and the page alike, so they cannot disagree.
 * Nothing is recomputed: every number is read from the result the approval rests on (the engine's hardware entry,
 * shared/engine/hardware.ts, standard TMD relations — Den Hartog 1956 / common practice):
 *   moving mass m = μ M, spring rate k = m ω_a², damper coefficient c = 2 ζ_a m ω_a, static deflection δ = g / ω_a²,
 * with ζ_a referred to the damper's own frequency f_a (ω_a = 2π f_a). Lengths are given in mm, everything else in SI.
 */
import type { SignOffSnapshot } from '../contracts/sign-offs';
import type { HardwareSheetEntry } from '../contracts/compute-design';
import { standardGravityMPerS2 } from '../engine/loads/floor-walking';

export const HARDWARE_SHEET_CAUTION =
  'These results support, and never replace, the judgement of a qualified engineer, who remains responsible for the design. ' +
  "Local codes, the project's specification and licensed practice govern.";

export interface HardwareSheetRow {
  section: string;
  quantity: string;
  /** A number (SI, lengths in mm) or a text (names, dates). */
  value: number | string;
  unit: string;
  note: string;
}

export interface HardwareSheetInput {
  projectName: string;
  signOff: { id: string; status: string; decidedAt: string | null; decisionComment: string | null; snapshot: SignOffSnapshot };
  /** The approver as they were at the decision (kept on the sign-off), never read at request time. */
  approver: { name: string | null; email: string } | null;
}

export interface HardwareSheet {
  projectName: string;
  variantName: string;
  /** The sign-off id's first 8 characters and the approval date (UTC), e.g. `1a2b3c4d-2026-12-02`. */
  revision: string;
  rows: HardwareSheetRow[];
  caution: string;
}

export class HardwareSheetUnavailableError extends Error {}

/** What the design rows are read from: a tuning variant with its result, and its mode. */
export type HardwareDesign = Pick<SignOffSnapshot, 'variant' | 'mode'>;

/** The load case whose hardware entry needs the largest design stroke (the governing one for the fabricator). */
export function governingHardwareEntry(design: HardwareDesign): { entry: HardwareSheetEntry; loadCaseName: string } {
  const result = design.variant.result;
  if (!result) throw new HardwareSheetUnavailableError('the design has no result');
  let best: { entry: HardwareSheetEntry; loadCaseName: string } | null = null;
  for (const loadCase of result.loadCases) {
    for (const entry of loadCase.hardware) {
      if (!best || entry.designStrokeM > best.entry.designStrokeM) best = { entry, loadCaseName: loadCase.name };
    }
  }
  if (!best) throw new HardwareSheetUnavailableError('the result holds no hardware entry');
  return best;
}

export function hardwareSheetRevision(signOffId: string, decidedAt: string | null): string {
  return `${signOffId.slice(0, 8)}-${(decidedAt ?? '').slice(0, 10)}`;
}

export function buildHardwareSheet(input: HardwareSheetInput): HardwareSheet {
  const { signOff, approver } = input;
  if (signOff.status !== 'approved') throw new HardwareSheetUnavailableError(`the sign-off is ${signOff.status}, not approved`);
  const { snapshot } = signOff;
  const rows = hardwareDesignRows(snapshot);
  const { variant } = snapshot;
  const add = (section: string, quantity: string, value: number | string, unit: string, note = '') => rows.push({ section, quantity, value, unit, note });
  add('approval', 'Tuning variant', variant.name, '');
  add(
    'approval',
    'Approved by',
    approver ? approver.name || approver.email : 'not recorded',
    '',
    approver ? approver.email : 'approved before the approver was kept with the approval',
  );
  add('approval', 'Approved at', signOff.decidedAt ?? '', 'UTC');
  add('approval', 'Comment', signOff.decisionComment ?? '', '');
  add('approval', 'Engine version', snapshot.engineVersion, '');

  return {
    projectName: input.projectName,
    variantName: variant.name,
    revision: hardwareSheetRevision(signOff.id, signOff.decidedAt),
    rows,
    caution: HARDWARE_SHEET_CAUTION,
  };
}

/**
 * The sheet's rows of the design itself (mode, damper, per unit, stroke, tuning range), without the approval: the
 * hardware sheet adds its approval rows, and the design report prints these for a design not yet approved.
 */
export function hardwareDesignRows(design: HardwareDesign): HardwareSheetRow[] {
  const { entry, loadCaseName } = governingHardwareEntry(design);
  const { mode, variant } = design;
  const n = entry.unitCount;
  const mm = (m: number) => m * 1000;
  const rows: HardwareSheetRow[] = [];
  const add = (section: string, quantity: string, value: number | string, unit: string, note = '') => rows.push({ section, quantity, value, unit, note });

  add('mode', 'Mode', mode.label, '', `${mode.direction}`);
  add('mode', 'Mode frequency', mode.frequencyHz, 'Hz');
  add('mode', 'Modal mass', mode.modalMassKg, 'kg');
  add('damper', 'Number of units', n, '');
  add('damper', 'Springs per unit', entry.springsPerUnit, '');
  add('damper', 'Mass ratio', variant.massRatio, '', 'total moving mass / modal mass');
  add('damper', 'Total moving mass', entry.movingMassKg, 'kg', 'm = μ M');
  add('damper', 'Target frequency', entry.frequencyHz, 'Hz', "the damper's own frequency f_a");
  add('damper', 'Damping ratio', entry.dampingRatio, '', `referred to the damper's own frequency f_a = ${fmt(entry.frequencyHz)} Hz`);
  add('per unit', 'Moving mass per unit', entry.perUnit.movingMassKg, 'kg', `m / ${n}`);
  add('per unit', 'Spring rate per unit', entry.perUnit.springRateNPerM, 'N/m', 'k = m (2π f_a)², per unit');
  add('per unit', 'Spring rate per spring', entry.perUnit.springRatePerSpringNPerM, 'N/m', `per unit / ${entry.springsPerUnit} springs in parallel`);
  add('per unit', 'Damper coefficient per unit', entry.perUnit.damperCoefficientNsPerM, 'N·s/m', 'c = 2 ζ_a m ω_a, per unit');
  add('per unit', 'Static deflection under the moving mass', mm(entry.staticDeflectionM), 'mm', `g / ω_a², g = ${standardGravityMPerS2} m/s²`);
  add('stroke', 'Largest stroke amplitude', mm(entry.maximumStrokeM), 'mm', `load case ${loadCaseName}`);
  add('stroke', 'Stroke margin', entry.strokeMarginFactor, '', 'design stroke = margin × largest stroke');
  add('stroke', 'Design stroke', mm(entry.designStrokeM), 'mm');
  add(
    'stroke',
    'Hardware travel',
    entry.strokeLimitM === null ? 'not given' : mm(entry.strokeLimitM),
    entry.strokeLimitM === null ? '' : 'mm',
    entry.strokeWithinLimit === null ? '' : entry.strokeWithinLimit ? 'design stroke within travel' : 'DESIGN STROKE EXCEEDS TRAVEL',
  );
  const r = entry.tuningRange;
  const pct = `±${fmt(r.ratio * 100)} %`;
  add('tuning range', 'Frequency, low end', r.minFrequencyHz, 'Hz', pct);
  add('tuning range', 'Frequency, high end', r.maxFrequencyHz, 'Hz', pct);
  add('tuning range', 'Spring rate per unit at constant mass, low end', r.minSpringRateNPerM / n, 'N/m', 'k ∝ f²');
  add('tuning range', 'Spring rate per unit at constant mass, high end', r.maxSpringRateNPerM / n, 'N/m', 'k ∝ f²');
  add('tuning range', 'Moving mass per unit at constant springs, for the high end', r.minMovingMassKg / n, 'kg', 'm ∝ 1/f²');
  add('tuning range', 'Moving mass per unit at constant springs, for the low end', r.maxMovingMassKg / n, 'kg', 'm ∝ 1/f²');
  return rows;
}

/** Six significant figures, no exponent for ordinary magnitudes. */
export function fmt(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  return String(Number(value.toPrecision(6)));
}

export function formatHardwareValue(value: number | string): string {
  return typeof value === 'number' ? fmt(value) : value;
}

/** RFC 4180: a field with a comma, quote, CR or LF is quoted, its quotes doubled; lines end with CRLF. */
function csvField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function hardwareSheetCsv(sheet: HardwareSheet): string {
  const lines = [['section', 'quantity', 'value', 'unit', 'note']];
  lines.push(['sheet', 'Project', sheet.projectName, '', '']);
  lines.push(['sheet', 'Revision', sheet.revision, '', '']);
  for (const row of sheet.rows) lines.push([row.section, row.quantity, formatHardwareValue(row.value), row.unit, row.note]);
  lines.push(['caution', 'Caution', sheet.caution, '', '']);
  return lines.map((line) => line.map(csvField).join(',')).join('\r\n') + '\r\n';
}
