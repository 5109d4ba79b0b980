/**
 * The engineer's design report of a tuning variant as a PDF (pdfkit, Work Sans): title block, inputs (the mode and
 * where it came from, the load cases and their sources, the comfort criteria), the tuning method and its source, the
 * results of every load case with its response plot and robustness map drawn from the same curves as the variant's
 * page, the detuning check, the hardware numbers (the hardware sheet's rows, shared/compute/hardware-sheet.ts), every
 * warning of the engine in plain words; the caution stands under the title block. SI units throughout; numbers with at least four significant
 * figures. A running header on every page names the project, the variant and its version, the engine version, the
 * time of generation and the page.
 */
import { formatHardwareValue, hardwareDesignRows, HardwareSheetUnavailableError } from '../../../shared/compute/hardware-sheet';
import { deriveBeamMode } from '../../../shared/engine/beam';
import type { TuningMethod, VariantCurves, VariantLoadCaseResult } from '../../../shared/contracts/variants';
import { FONT_REGULAR, FONT_SEMIBOLD, latin } from '../../pdf/fonts';
import { PageWriter, pageColours } from '../../pdf/layout';
import { drawCellMap, drawLinePlot, plotColours, type LineSeries } from '../../pdf/plots';
import { variantReportRevision, type VariantReportData } from './report.service';

// ---------- numbers ----------

/**
 * A number for the report: four significant figures (trailing zeros kept, so the precision shows) from 0.0001 to
 * 1000; whole numbers from 1000 up to 1e9 (four or more figures); an exponent beyond.
 */
export function reportNumber(value: number | null | undefined): string {
  if (value === null || value === undefined) return 'unbounded';
  if (!Number.isFinite(value)) return value > 0 ? 'unbounded' : String(value);
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1000 && magnitude < 1e9) return String(Math.round(value));
  if (magnitude >= 1e-4 && magnitude < 1000) return value.toPrecision(4);
  return value.toExponential(3);
}

/** A ratio as a percentage with four significant figures. */
const percent = (ratio: number) => `${reportNumber(ratio * 100)} %`;
const mm = (metres: number) => `${reportNumber(metres * 1000)} mm`;
const hz = (v: number) => `${reportNumber(v)} Hz`;
const accel = (v: number | null | undefined) => (v === null || v === undefined ? 'unbounded' : `${reportNumber(v)} m/s²`);
const iso = (date: Date) => `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

// ---------- words ----------

/** Published methods by their authors' names, with the source and the rule the engine applies. */
export const tuningMethodWords: Record<TuningMethod, { name: string; source: string; rule: string }> = {
  'den-hartog': {
    name: 'Den Hartog',
    source: 'J. P. Den Hartog, Mechanical Vibrations (1956): optimum for a harmonic force on an undamped structure',
    rule: 'f_a / f_s = 1 / (1 + mu); zeta_a = sqrt(3 mu / (8 (1 + mu))), referred to the damper\'s own frequency f_a',
  },
  'warburton-random': {
    name: 'Warburton',
    source: 'G. B. Warburton, Earthquake Engineering and Structural Dynamics 10 (1982): optimum for a white-noise force on an undamped structure',
    rule: 'f_a / f_s = sqrt(1 + mu/2) / (1 + mu); zeta_a = sqrt(mu (1 + 3mu/4) / (4 (1 + mu)(1 + mu/2))), referred to f_a',
  },
  'ioi-ikeda': {
    name: 'Ioi & Ikeda',
    source: 'T. Ioi and K. Ikeda (1978): correction of the harmonic-force optimum for the structure\'s own damping zeta_s',
    rule:
      'f_a / f_s = 1/(1 + mu) - (0.241 + 1.7 mu - 2.6 mu²) zeta_s - (1 - 1.9 mu + mu²) zeta_s²; zeta_a = sqrt(3 mu / (8 (1 + mu))) + (0.13 + 0.12 mu + 0.4 mu²) zeta_s - (0.01 + 0.9 mu + 3 mu²) zeta_s², referred to f_a',
  },
  hinf: {
    name: 'numerical H-infinity optimum',
    source: "Stillspan's engine (docs/engine.md, Tuning): the least largest response |X_s| K / F over all frequencies, for the structure's own damping",
    rule: 'f_a and zeta_a found by a nested Brent search; zeta_a referred to f_a',
  },
  h2: {
    name: 'numerical H2 optimum',
    source: "Stillspan's engine (docs/engine.md, Tuning): the least mean-square response to a white-noise force, for the structure's own damping",
    rule: 'f_a and zeta_a found by a Brent search on the exact stationary variance (Lyapunov equation); zeta_a referred to f_a',
  },
};

const loadCaseKindWords: Record<string, string> = {
  harmonic: 'harmonic force over a pacing band',
  walker: 'one walker, steady state',
  jogger: 'one jogger, steady state',
  crowd: 'crowd of pedestrians',
  lateral: 'lateral crowd with the lock-in check',
  'floor-walking': 'walking on a floor (AISC Design Guide 11)',
  'moving-walker': 'one walker crossing the span (time history)',
};

const guideWords: Record<string, string> = { setra: 'Sétra 2006', hivoss: 'HiVoSS 2008' };

/** The load case's own values, with their units; what it leaves out takes the load model's default. */
function loadCaseValues(spec: Record<string, unknown>): string {
  const words: Record<string, [string, string]> = {
    guide: ['guide', ''],
    trafficClass: ['traffic class', ''],
    densityPerM2: ['density', 'persons/m²'],
    deckAreaM2: ['loaded deck area', 'm²'],
    modeShapeMean: ['mean |phi| over the deck', ''],
    harmonic: ['pedestrian force harmonic', ''],
    pacingRangeHz: ['pacing band', 'Hz'],
    modalForceAmplitudeN: ['modal force amplitude', 'N'],
    bodyWeightN: ['body weight', 'N'],
    modeShapeValue: ['|phi| where the person walks', ''],
    lockInCoefficientNsPerM: ['lock-in coefficient k', 'N·s/m per person'],
    constantForceN: ['constant force P0', 'N'],
    stepFrequencyRangeHz: ['step frequency band', 'Hz'],
    harmonicCount: ['walking harmonics', ''],
    effectiveWeightN: ['effective weight W', 'N'],
    spanM: ['span', 'm'],
    gait: ['gait', ''],
    pacingFrequencyHz: ['pacing frequency', 'Hz'],
    walkingSpeedMPerS: ['walking speed', 'm/s'],
    timeStepS: ['time step', 's'],
    trailingTimeS: ['time after the crossing', 's'],
  };
  const parts: string[] = [];
  for (const [key, value] of Object.entries(spec)) {
    if (key === 'kind' || value === undefined) continue;
    const [label, unit] = words[key] ?? [key, ''];
    let shown: string;
    if (key === 'guide') shown = guideWords[String(value)] ?? String(value);
    else if (Array.isArray(value)) shown = value.map((v) => reportNumber(Number(v))).join('–');
    else if (typeof value === 'number') shown = Number.isInteger(value) && Math.abs(value) < 1000 ? String(value) : reportNumber(value);
    else shown = String(value);
    parts.push(`${label} ${shown}${unit ? ` ${unit}` : ''}`);
  }
  return parts.length ? parts.join('; ') : 'all values the load model\'s defaults';
}

const fromMemoryCodes = new Set(['load-value-from-memory', 'psi-shape-assumed']);
const isFromMemory = (text: string) => /from memory|assumed/i.test(text);

const criteriaSetWords: Record<string, string> = {
  setra: 'Sétra 2006 comfort classes',
  hivoss: 'HiVoSS 2008 comfort classes',
  en1990: 'EN 1990 Annex A2 (A2.4.3.2)',
  dg11: 'AISC Design Guide 11',
  iso10137: 'ISO 10137 (base curve of ISO 2631-2)',
  custom: 'custom limit of the project',
};

function sentenceCase(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

// ---------- the plots of one load case ----------

/** The bands of a load case on one frequency axis, a gap (NaN) between bands that do not touch (as the page joins them). */
function joinedBands(curves: VariantCurves) {
  const bands = [...curves.response].sort((a, b) => a.loHz - b.loHz);
  const x: number[] = [];
  const withDamper: number[] = [];
  const bare: Array<number | null> = [];
  const limit: number[] = [];
  const varying = bands.length > 0 && bands.every((b) => b.limitMPerS2);
  bands.forEach((band, b) => {
    if (b > 0) {
      x.push((bands[b - 1].hiHz + band.loHz) / 2);
      withDamper.push(NaN);
      bare.push(null);
      limit.push(NaN);
    }
    for (let i = 0; i < band.frequencyHz.length; i++) {
      x.push(band.frequencyHz[i]);
      withDamper.push(band.accelerationMPerS2[i]);
      bare.push(band.bareStructureAccelerationMPerS2[i]);
      limit.push(band.limitMPerS2?.[i] ?? NaN);
    }
  });
  return { x, withDamper, bare, limit: varying ? limit : null, bands: bands.map((b) => [b.loHz, b.hiHz] as const) };
}

export const plotTitles = {
  forceFrequency: 'frequency of the force [Hz]',
  peakAcceleration: 'peak acceleration [m/s²]',
  structureFrequency: 'structure frequency [Hz]',
  damperDamping: 'damper damping ratio, referred to f_a [%]',
  time: 'time [s]',
  acceleration: 'acceleration [m/s²]',
} as const;

function drawLoadCasePlots(w: PageWriter, data: VariantReportData, curves: VariantCurves): void {
  const { variant, mode } = data;
  if (curves.timeHistory) {
    const h = curves.timeHistory;
    w.paragraph(`Structure acceleration while one walker crosses the span, with and without the damper (every ${h.decimation} time steps shown, each stretch keeping its largest value).`, {
      size: 8,
      colour: pageColours.muted,
    });
    const box = w.reserve(250);
    drawLinePlot(w.doc, box, {
      xTitle: plotTitles.time,
      yTitle: plotTitles.acceleration,
      yFromZero: false,
      series: [
        { label: 'bare structure', x: h.timesS, y: h.bareStructureAccelerationMPerS2, colour: plotColours.bare, width: 0.7 },
        { label: 'with damper', x: h.timesS, y: h.structureAccelerationMPerS2, colour: plotColours.withDamper, width: 0.9 },
        { label: 'running 1-s r.m.s., with damper', x: h.timesS, y: h.runningRms1sMPerS2, colour: plotColours.ink, width: 1.2 },
      ],
      rules: [{ value: curves.limitMPerS2, label: `comfort limit ${accel(curves.limitMPerS2)}` }],
    });
    return;
  }
  const joined = joinedBands(curves);
  w.paragraph(
    `Peak acceleration of the structure at each frequency of the force, with the damper and without; shaded: the bands the load case loads.${
      curves.peak ? ` Peak with the damper ${accel(curves.peak.accelerationMPerS2)} at ${hz(curves.peak.frequencyHz)}.` : ''
    }`,
    { size: 8, colour: pageColours.muted },
  );
  const series: LineSeries[] = [
    { label: 'bare structure', x: joined.x, y: joined.bare, colour: plotColours.bare, width: 1, dash: [3, 2] },
    { label: 'with damper', x: joined.x, y: joined.withDamper, colour: plotColours.withDamper, width: 1.6 },
  ];
  if (joined.limit) series.push({ label: 'comfort limit at each frequency', x: joined.x, y: joined.limit, colour: plotColours.limit, width: 1.1, dash: [6, 2.5] });
  const responseBox = w.reserve(205);
  drawLinePlot(w.doc, responseBox, {
    xTitle: plotTitles.forceFrequency,
    yTitle: plotTitles.peakAcceleration,
    series,
    bands: joined.bands,
    xRange: joined.bands.length ? [joined.bands[0][0], joined.bands[joined.bands.length - 1][1]] : undefined,
    rules: joined.limit ? [] : [{ value: curves.limitMPerS2, label: `comfort limit ${accel(curves.limitMPerS2)}` }],
    points: curves.peak ? [{ x: curves.peak.frequencyHz, y: curves.peak.accelerationMPerS2, label: `peak ${reportNumber(curves.peak.accelerationMPerS2)}`, colour: plotColours.withDamper }] : [],
  });
  const map = curves.robustness;
  if (!map) return;
  const r = variant.structureFrequencyToleranceRatio;
  const d = variant.tmdDampingToleranceRatio ?? 0;
  w.ensureSpace(270);
  w.paragraph(
    `Robustness map: the largest peak acceleration over the loaded band as the structure's frequency (horizontal) and the damper's damping ratio (vertical) move away from the design point (ring). ${
      d ? `Dashed frame: the detuning band ±${percent(r)} and the damping tolerance ±${percent(d)}.` : `Dashed lines: the detuning band ±${percent(r)}.`
    }`,
    { size: 8, colour: pageColours.muted },
  );
  const mapBox = w.reserve(240);
  drawCellMap(w.doc, mapBox, {
    xs: map.structureFrequencyHz,
    ys: map.tmdDampingRatio.map((z) => z * 100),
    values: map.peakAccelerationMPerS2,
    limit: map.limitMPerS2,
    xTitle: plotTitles.structureFrequency,
    yTitle: plotTitles.damperDamping,
    valueTitle: plotTitles.peakAcceleration,
    marker: { x: mode.frequencyHz, y: curves.tmd.dampingRatio * 100 },
    region: {
      x0: mode.frequencyHz * (1 - r),
      x1: mode.frequencyHz * (1 + r),
      y0: curves.tmd.dampingRatio * (1 - d) * 100,
      y1: curves.tmd.dampingRatio * (1 + d) * 100,
    },
    formatValue: (v) => reportNumber(v),
  });
}

// ---------- the report ----------

function verdictWord(verdict: string | undefined): string {
  return verdict === 'pass' ? 'PASS' : verdict === 'fail' ? 'FAIL' : '—';
}

function loadCaseFacts(lc: VariantLoadCaseResult): Array<[string, string]> {
  const facts: Array<[string, string]> = [
    ['Load model', lc.loadModel.source],
    ['Force bands', lc.loadModel.bandsHz.map(([a, b]) => `${reportNumber(a)}–${reportNumber(b)} Hz`).join(', ') || '—'],
    ['Modal force at the peak', `${reportNumber(lc.modalForceAmplitudeN)} N`],
  ];
  if (lc.pedestrianCount !== undefined) facts.push(['Pedestrians on the deck', reportNumber(lc.pedestrianCount)]);
  if (lc.equivalentPedestrians !== undefined) facts.push(["Equivalent synchronised pedestrians n'", reportNumber(lc.equivalentPedestrians)]);
  facts.push(['Peak with the damper', `${accel(lc.peakAccelerationMPerS2)} at ${hz(lc.atFrequencyHz)}`]);
  facts.push(['Peak of the bare structure', `${accel(lc.bareStructurePeakAccelerationMPerS2)} at ${hz(lc.bareStructureAtFrequencyHz)}`]);
  if (lc.criterion) facts.push(['Comfort limit', `${accel(lc.criterion.limitMPerS2)} (${lc.criterion.label})`]);
  if (lc.utilisation !== undefined) facts.push(['Use of the limit', `${percent(lc.utilisation)}: ${verdictWord(lc.verdict)}`]);
  if (lc.comfortClass) facts.push(['Comfort class reached', `${lc.comfortClass} (bare structure: ${lc.bareStructureComfortClass ?? '—'})`]);
  lc.tmdStrokeM.forEach((s, j) => facts.push([`Damper stroke amplitude${lc.tmdStrokeM.length > 1 ? ` ${j + 1}` : ''}`, `${mm(s)} at ${hz(lc.tmdStrokeAtFrequencyHz[j])}`]));
  if (lc.lockIn) {
    facts.push([
      'Lateral lock-in',
      `critical number of pedestrians ${reportNumber(lc.lockIn.criticalPedestrians)} with the damper (${reportNumber(lc.lockIn.bareStructureCriticalPedestrians)} without), expected ${reportNumber(lc.lockIn.expectedPedestrians)}: ${lc.lockIn.lockInExpected ? 'LOCK-IN EXPECTED' : 'no lock-in expected'}; k = ${reportNumber(lc.lockIn.coefficientNsPerM)} N·s/m per person (${lc.lockIn.source})`,
    ]);
  }
  if (lc.dg11) {
    facts.push([
      'AISC DG11 formula (bare floor)',
      `${accel(lc.dg11.formulaPeakAccelerationMPerS2)}; P0 = ${reportNumber(lc.dg11.constantForceN)} N, W = ${reportNumber(lc.dg11.effectiveWeightN)} N`,
    ]);
  }
  if (lc.timeHistory) {
    const h = lc.timeHistory;
    facts.push([
      'Crossing',
      `pacing ${hz(h.pacingFrequencyHz)}, speed ${reportNumber(h.walkingSpeedMPerS)} m/s, crossing time ${reportNumber(h.crossingTimeS)} s, time step ${reportNumber(h.timeStepS)} s`,
    ]);
    facts.push(['Largest 1-s r.m.s.', `${accel(h.maxRunningRms1sMPerS2)} with the damper, ${accel(h.bareStructureMaxRunningRms1sMPerS2)} without`]);
    facts.push(['Steady state of the resonant harmonic', accel(h.steadyStatePeakAccelerationMPerS2)]);
  }
  return facts;
}

/** The hardware sheet's rows for the design as it stands (its approval section left out: this report is not an approval). */
function hardwareRows(data: VariantReportData): string[][] | null {
  try {
    const shown = hardwareDesignRows({ variant: data.variant, mode: data.mode }).filter((row) => row.section !== 'mode');
    // Whole numbers (counts) as they are, other numbers with the report's four significant figures; each section named once.
    return shown.map((row, i) => [
      i > 0 && shown[i - 1].section === row.section ? '' : row.section,
      row.quantity,
      typeof row.value === 'number' && !Number.isInteger(row.value) ? reportNumber(row.value) : formatHardwareValue(row.value),
      row.unit,
      row.note,
    ]);
  } catch (error) {
    if (error instanceof HardwareSheetUnavailableError) return null;
    throw error;
  }
}

export function variantReportPdf(data: VariantReportData): Promise<Buffer> {
  const { variant, mode, criteria } = data;
  const result = variant.result;
  const revision = variantReportRevision(variant);
  const w = new PageWriter({ title: `Design report ${data.projectName} ${variant.name} ${revision}` });
  const doc = w.doc;
  const nameOf = (id: string) => result.loadCases.find((lc) => lc.loadCaseId === id)?.name ?? id;

  // ---- title block ----
  doc.font(FONT_SEMIBOLD).fontSize(8).fillColor(pageColours.alert).text('STILLSPAN · DESIGN REPORT', w.left, w.y, { characterSpacing: 1.2 });
  doc.moveDown(0.2);
  doc.font(FONT_SEMIBOLD).fontSize(19).fillColor(pageColours.ink).text(latin(`Tuned mass damper: ${variant.name}`), w.left, doc.y, { width: w.width });
  doc.font(FONT_REGULAR).fontSize(10.5).fillColor(pageColours.soft).text(latin(`${data.projectName}${data.structure ? ` · ${data.structure.name}` : ''} · ${mode.label}`), { width: w.width });
  doc.moveDown(0.6);
  const blockTop = doc.y;
  const blockRows: Array<[string, string, string, string]> = [
    ['Project', data.projectName, 'Revision', revision],
    ['Structure', data.structure ? `${data.structure.name} (${data.structure.kind})` : '—', 'Variant version', String(variant.version)],
    ['Tuning variant', variant.name, 'Engine version', result.engineVersion],
    ['Comfort criteria', `${criteria.name} (${criteria.status})`, 'Result computed', iso(new Date(result.computedAt))],
    ['Generated for', `${data.generatedFor.name} <${data.generatedFor.email}>`, 'Generated', iso(data.generatedAt)],
    ['Inputs fingerprint', `sha256 ${result.inputsHash.slice(0, 16)}…`, 'Units', 'SI (kg, N, m, s, Hz)'],
  ];
  doc.fontSize(8.5);
  let y = blockTop + 6;
  const colW = w.width / 2;
  for (const [k1, v1, k2, v2] of blockRows) {
    doc.font(FONT_SEMIBOLD).fillColor(pageColours.muted);
    doc.text(latin(k1), w.left + 8, y, { width: 92 });
    doc.text(latin(k2), w.left + colW + 8, y, { width: 92 });
    doc.font(FONT_REGULAR).fillColor(pageColours.ink);
    const h1 = doc.heightOfString(latin(v1), { width: colW - 108 });
    const h2 = doc.heightOfString(latin(v2), { width: colW - 108 });
    doc.text(latin(v1), w.left + 100, y, { width: colW - 108 });
    doc.text(latin(v2), w.left + colW + 100, y, { width: colW - 108 });
    y += Math.max(h1, h2) + 4;
  }
  doc.save().lineWidth(1).strokeColor(pageColours.ink).rect(w.left, blockTop, w.width, y - blockTop + 2).stroke();
  doc.moveTo(w.left + colW, blockTop).lineTo(w.left + colW, y + 2).lineWidth(0.5).strokeColor(pageColours.rule).stroke().restore();
  w.y = y + 10;

  // ---- caution, under the title block: the engine's own (shared/engine/design.ts), as every result carries it ----
  const cautionText = `Caution. ${result.caution}`;
  doc.font(FONT_SEMIBOLD).fontSize(9);
  const ch = doc.heightOfString(latin(cautionText), { width: w.width - 20 });
  const cautionBox = w.reserve(ch + 14, 6);
  doc.save().lineWidth(1.2).strokeColor(pageColours.alert).rect(cautionBox.x, cautionBox.y, cautionBox.width, cautionBox.height).stroke().restore();
  doc.fillColor(pageColours.ink).text(latin(cautionText), cautionBox.x + 10, cautionBox.y + 7, { width: w.width - 20 });
  w.y = cautionBox.y + cautionBox.height + 6;

  // ---- summary ----
  w.heading('1  Summary');
  const governing = result.governing;
  const d = result.detuning;
  const method = 'method' in variant.tuning ? tuningMethodWords[variant.tuning.method] : null;
  w.keyValues([
    ['Damper', `mass ratio ${reportNumber(result.massRatio)} (${percent(result.massRatio)}); moving mass ${reportNumber(result.tmd.massKg)} kg in ${result.unitCount} unit(s); own frequency f_a = ${hz(result.tmd.frequencyHz)}; damping ratio zeta_a = ${reportNumber(result.tmd.dampingRatio)} (${percent(result.tmd.dampingRatio)} of critical, referred to f_a)`],
    ['Tuning', method ? `${method.name}` : `set by hand: f_a = ${hz(result.tmd.frequencyHz)}, zeta_a = ${reportNumber(result.tmd.dampingRatio)} referred to f_a`],
    ['Governing load case', `${nameOf(governing.loadCaseId)}: ${accel(governing.peakAccelerationMPerS2)}, ${percent(governing.utilisation)} of the limit: ${verdictWord(governing.verdict)}`],
    ['Detuning', `structure frequency ${hz(d.structureFrequencyRangeHz[0])} to ${hz(d.structureFrequencyRangeHz[1])} (±${percent(d.structureFrequencyToleranceRatio)}): worst ${accel(d.worstPeakAccelerationMPerS2)}, ${percent(d.worstUtilisation)} of the limit: ${verdictWord(d.verdict)}`],
    ['Warnings', `${countWarnings(data)} (section 7)`],
  ]);

  // ---- inputs ----
  w.heading('2  Inputs');
  w.heading('2.1  Mode', 2);
  const modeRows: Array<[string, string]> = [
    ['Mode', `${mode.label} (${mode.direction})`],
    ['Natural frequency f_s', hz(mode.frequencyHz)],
    ['Modal mass M', `${reportNumber(mode.modalMassKg)} kg (mode shape scaled to 1 at the damper's position)`],
    ['Damping ratio zeta_s', `${reportNumber(mode.dampingRatio)} (${percent(mode.dampingRatio)} of critical, referred to f_s)`],
    ['Modal stiffness K = M (2 pi f_s)²', `${reportNumber(mode.modalMassKg * (2 * Math.PI * mode.frequencyHz) ** 2)} N/m`],
    ['Mean |phi| over the deck', mode.modeShapeMean === null ? 'not given' : reportNumber(mode.modeShapeMean)],
  ];
  const source = mode.source;
  if (source.kind === 'typed') {
    modeRows.push(['Source', 'typed in: the numbers come from an analysis outside Stillspan (an FE model or a hand calculation), which the engineer of record keeps on file']);
  } else if (source.kind === 'beam') {
    const beam = deriveBeamMode(source);
    modeRows.push(['Source', `derived from a uniform Euler-Bernoulli beam, ${source.support}, mode ${source.modeNumber}`]);
    modeRows.push(['Beam', `L = ${reportNumber(source.lengthM)} m; EI = ${reportNumber(source.bendingStiffnessNM2)} N·m²; m = ${reportNumber(source.massPerLengthKgPerM)} kg/m`]);
    modeRows.push([
      'Derivation',
      `f_n = lambda_n² / (2 pi L²) · sqrt(EI / m) with lambda_n = ${reportNumber(beam.eigenvalueParameter)}; M = ${reportNumber(beam.modalMassFraction)} · m L (shape scaled to 1 at its largest |phi|); mean |phi| = ${reportNumber(beam.modeShapeMean)}`,
    ]);
  } else {
    const model = data.lumpedModel;
    modeRows.push(['Source', `derived from the lumped model "${model?.name ?? source.modelId}"${model ? ` (${model.dofCount} degrees of freedom)` : ''}`]);
    modeRows.push([
      'Derivation',
      `undamped mode ${source.modeNumber} (ascending frequency) of det(K - w² M) = 0; modal mass M = 1 / phi_j² of the mass-normalised shape at DOF ${source.dofIndex}${model?.dofLabel ? ` (${model.dofLabel})` : ''}, where the damper sits`,
    ]);
  }
  w.keyValues(modeRows);

  w.heading('2.2  Load cases', 2);
  w.table(
    [
      { title: 'Load case', width: 0.2 },
      { title: 'Kind', width: 0.17 },
      { title: 'Values given', width: 0.3 },
      { title: 'Load model and its source', width: 0.33 },
    ],
    data.loadCases.map((lc) => {
      const res = result.loadCases.find((r) => r.loadCaseId === lc.id);
      const memory = res?.warnings.filter((x) => fromMemoryCodes.has(x.code)).length ? ' [FROM MEMORY: see section 7]' : '';
      return [lc.name, loadCaseKindWords[lc.spec.kind] ?? lc.spec.kind, loadCaseValues(lc.spec as Record<string, unknown>), `${res?.loadModel.source ?? '—'}${memory}`];
    }),
  );

  w.heading('2.3  Comfort criteria', 2);
  const spec = criteria.spec as { set: string; class?: string; peakAccelerationLimitMPerS2?: number; responseFactor?: number };
  const criterionRows: Array<[string, string]> = [
    ['Criteria', `${criteria.name} (status: ${criteria.status})`],
    ['Set and class', `${criteriaSetWords[spec.set] ?? spec.set}${spec.class ? `, class ${spec.class}` : ''}${spec.responseFactor ? `, response factor ${reportNumber(spec.responseFactor)}` : ''}`],
  ];
  const seen = new Set<string>();
  for (const lc of result.loadCases) {
    const c = lc.criterion;
    if (!c || seen.has(c.label)) continue;
    seen.add(c.label);
    criterionRows.push([c.label, `limit ${accel(c.limitMPerS2)} (peak)${isFromMemory(c.source) ? ' [FROM MEMORY]' : ''}; source: ${c.source}. ${c.caution}`]);
  }
  w.keyValues(criterionRows);

  // ---- tuning ----
  w.heading('3  Method of tuning');
  const tuningRows: Array<[string, string]> = method
    ? [
        ['Method', method.name],
        ['Source', method.source],
        ['Rule', method.rule],
      ]
    : [['Method', 'set by hand: the damper\'s own frequency and damping ratio are the engineer\'s choice, kept when the mode changes']];
  tuningRows.push(
    ['Mass ratio mu', `${reportNumber(result.massRatio)} (${percent(result.massRatio)} of the modal mass)`],
    ['Total moving mass m = mu M', `${reportNumber(result.tmd.massKg)} kg`],
    ["Damper's own frequency f_a", `${hz(result.tmd.frequencyHz)} (f_a / f_s = ${reportNumber(result.tmd.frequencyHz / mode.frequencyHz)})`],
    ['Damping ratio zeta_a', `${reportNumber(result.tmd.dampingRatio)}, referred to the damper's own frequency f_a (c = 2 zeta_a m (2 pi f_a))`],
    ['Units', `${result.unitCount} equal unit(s), each with the whole damper's f_a and zeta_a`],
  );
  w.keyValues(tuningRows);

  // ---- results ----
  w.heading('4  Results per load case');
  w.paragraph('Steady-state peak acceleration over the loaded band (the continuous maximum of the engine\'s envelope), with the damper and without, against the comfort limit.', {
    size: 8.5,
    colour: pageColours.muted,
  });
  w.table(
    [
      { title: 'Load case', width: 0.19 },
      { title: 'Bare structure', width: 0.15, align: 'right' },
      { title: 'With damper', width: 0.15, align: 'right' },
      { title: 'Limit', width: 0.1, align: 'right' },
      { title: 'Use of limit', width: 0.09, align: 'right' },
      { title: 'Stroke', width: 0.1, align: 'right' },
      { title: 'Class', width: 0.13 },
      { title: 'Verdict', width: 0.09 },
    ],
    result.loadCases.map((lc) => [
      `${lc.name}${lc.loadCaseId === governing.loadCaseId && result.loadCases.length > 1 ? ' (governs)' : ''}`,
      `${accel(lc.bareStructurePeakAccelerationMPerS2)} at ${hz(lc.bareStructureAtFrequencyHz)}`,
      `${accel(lc.peakAccelerationMPerS2)} at ${hz(lc.atFrequencyHz)}`,
      lc.criterion ? accel(lc.criterion.limitMPerS2) : '—',
      lc.utilisation === undefined ? '—' : percent(lc.utilisation),
      lc.tmdStrokeM.length ? mm(Math.max(...lc.tmdStrokeM)) : '—',
      lc.comfortClass ?? '—',
      verdictWord(lc.verdict),
    ]),
    { size: 8, emphasis: (r, c) => (c === 7 ? (result.loadCases[r].verdict === 'fail' ? pageColours.alert : pageColours.pass) : null) },
  );

  result.loadCases.forEach((lc, i) => {
    w.newPage();
    w.heading(`4.${i + 1}  ${lc.name}`, 2);
    const curves = data.curves.find((c) => c.loadCaseId === lc.loadCaseId);
    if (data.plotEngineVersion) {
      w.paragraph(
        `The numbers of this report are the stored result of engine ${result.engineVersion}, which the design was approved with; the plots below were computed by engine ${data.plotEngineVersion} and may differ slightly.`,
        { size: 8.5, colour: pageColours.alert },
      );
    }
    if (curves) drawLoadCasePlots(w, data, curves);
    w.keyValues(loadCaseFacts(lc), { size: 8 });
  });

  // ---- detuning ----
  w.heading('5  Detuning');
  w.paragraph(
    `The damper held at its tuning while the structure's frequency moves over ${hz(d.structureFrequencyRangeHz[0])} to ${hz(d.structureFrequencyRangeHz[1])} (±${percent(d.structureFrequencyToleranceRatio)}: crowds, temperature, as-built stiffness)${
      d.tmdDampingToleranceRatio === null ? '' : ` and its damping ratio over ±${percent(d.tmdDampingToleranceRatio)}`
    }. Worst over the band and every load case: ${accel(d.worstPeakAccelerationMPerS2)}, ${percent(d.worstUtilisation)} of the limit, at ${hz(d.atStructureFrequencyHz)} with zeta_a = ${reportNumber(d.atTmdDampingRatio)} (${nameOf(d.loadCaseId)}): ${verdictWord(d.verdict)}.`,
    { size: 9 },
  );
  w.table(
    [
      { title: 'Load case', width: 0.3 },
      { title: 'Worst peak', width: 0.18, align: 'right' },
      { title: 'Use of limit', width: 0.16, align: 'right' },
      { title: 'At structure frequency', width: 0.18, align: 'right' },
      { title: 'At zeta_a', width: 0.18, align: 'right' },
    ],
    d.loadCases.map((x) => [nameOf(x.loadCaseId), accel(x.worstPeakAccelerationMPerS2), percent(x.worstUtilisation), hz(x.atStructureFrequencyHz), reportNumber(x.atTmdDampingRatio)]),
  );

  // ---- hardware ----
  w.heading('6  Hardware');
  const rows = hardwareRows(data);
  if (!rows) {
    w.paragraph('No hardware numbers: no load case gave a damper stroke.');
  } else {
    w.paragraph(
      'Per unit and for the whole damper, for the load case that asks the most travel (the numbers of the hardware sheet; lengths in mm). Every damping ratio names the frequency it is referred to.',
      { size: 8.5, colour: pageColours.muted },
    );
    w.table(
      [
        { title: 'Section', width: 0.12 },
        { title: 'Quantity', width: 0.33 },
        { title: 'Value', width: 0.14, align: 'right' },
        { title: 'Unit', width: 0.07 },
        { title: 'Note', width: 0.34 },
      ],
      rows,
      { size: 8 },
    );
  }

  // ---- warnings ----
  w.heading('7  Warnings');
  const warnings = collectWarnings(data);
  if (!warnings.length) w.paragraph('The engine raised no warning for this design.');
  warnings.forEach((x, i) => {
    w.paragraph(`${i + 1}.  ${x.memory ? 'FROM MEMORY: ' : ''}${sentenceCase(x.message)}${x.loadCases.length ? ` (${x.loadCases.join(', ')})` : ''}`, {
      size: 8.5,
      colour: x.memory ? pageColours.alert : pageColours.ink,
      gapAfter: 3,
    });
  });

  const generated = iso(data.generatedAt);
  return w.finish((page, count) => {
    doc.font(FONT_SEMIBOLD).fontSize(8).fillColor(pageColours.ink);
    doc.text(latin(`${data.projectName}`), w.left, 22, { width: w.width * 0.55, lineBreak: false, ellipsis: true });
    doc.text(latin(`${variant.name} · version ${variant.version}`), w.left + w.width * 0.45, 22, { width: w.width * 0.55, align: 'right', lineBreak: false, ellipsis: true });
    doc.font(FONT_REGULAR).fontSize(7.5).fillColor(pageColours.muted);
    doc.text(latin(`Design report ${revision} · engine ${result.engineVersion} · generated ${generated}`), w.left, 34, { width: w.width * 0.75, lineBreak: false });
    doc.text(`page ${page + 1} of ${count}`, w.left + w.width * 0.6, 34, { width: w.width * 0.4, align: 'right', lineBreak: false });
    doc.save().lineWidth(0.6).strokeColor(pageColours.rule).moveTo(w.left, 47).lineTo(w.right, 47).stroke().restore();
    const footY = doc.page.height - 32;
    doc.save().lineWidth(0.4).strokeColor(pageColours.rule).moveTo(w.left, footY - 5).lineTo(w.right, footY - 5).stroke().restore();
    doc.font(FONT_REGULAR).fontSize(6.8).fillColor(pageColours.muted);
    doc.text(
      'Supports, and never replaces, the judgement of a qualified engineer; local codes and licensed practice govern. Stillspan',
      w.left,
      footY,
      { width: w.width, lineBreak: false },
    );
  });
}

interface ReportWarning {
  message: string;
  memory: boolean;
  loadCases: string[];
}

/** Every warning of the result once, with the load cases it came from; values from memory flagged. */
function collectWarnings(data: VariantReportData): ReportWarning[] {
  const byMessage = new Map<string, ReportWarning>();
  const add = (code: string, message: string, loadCase: string | null) => {
    const entry = byMessage.get(message) ?? { message, memory: fromMemoryCodes.has(code) || isFromMemory(message), loadCases: [] };
    if (loadCase && !entry.loadCases.includes(loadCase)) entry.loadCases.push(loadCase);
    byMessage.set(message, entry);
  };
  for (const x of data.variant.result.warnings) add(x.code, x.message, null);
  for (const lc of data.variant.result.loadCases) for (const x of lc.warnings) add(x.code, x.message, lc.name);
  // A limit from memory decides a verdict: say so among the warnings too.
  for (const lc of data.variant.result.loadCases) {
    const c = lc.criterion;
    if (c && isFromMemory(c.source)) add('criterion-from-memory', `the comfort limit ${c.label} (${reportNumber(c.limitMPerS2)} m/s²) rests on a value from memory: ${c.source}`, lc.name);
  }
  return [...byMessage.values()];
}

function countWarnings(data: VariantReportData): string {
  const warnings = collectWarnings(data);
  const n = warnings.length;
  const memory = warnings.filter((x) => x.memory).length;
  return n === 0 ? 'none' : `${n}, of which ${memory} ${memory === 1 ? 'concerns' : 'concern'} values from memory`;
}

