import type { HardwareSheetEntry, VariantComputation, VariantLoadCaseResult } from '../../../../shared/contracts';
import { Panel } from '../../../components/ui/panel';
import { Table, Td, Th } from '../../../components/ui/table';
import { useDisplayUnits } from '../../../lib/display-units';
import { formatNumber, formatPercent } from '../../../lib/format';
import { UtilisationBar, VerdictTag } from './verdict-tag';

/** The largest stroke of a load case's dampers (one entry per damper; a variant has one damper split in units). */
export function strokeOf(loadCase: VariantLoadCaseResult): number {
  return loadCase.tmdStrokeM.length ? Math.max(...loadCase.tmdStrokeM) : 0;
}

/** The hardware entry of the load case that asks the most travel: the one the hardware sheet is built for. */
export function governingHardware(result: VariantComputation): { entry: HardwareSheetEntry; loadCaseName: string } | null {
  let best: { entry: HardwareSheetEntry; loadCaseName: string } | null = null;
  for (const loadCase of result.loadCases) {
    const entry = loadCase.hardware[0];
    if (entry && (!best || entry.designStrokeM > best.entry.designStrokeM)) best = { entry, loadCaseName: loadCase.name };
  }
  return best;
}

/** One row per load case: the criteria it is checked against, bare vs with the damper, the stroke and the verdict. */
export function LoadCaseVerdicts({ result }: { result: VariantComputation }) {
  const units = useDisplayUnits();
  return (
    <div className="flex flex-col gap-4">
      <Table caption="Verdict per load case">
        <thead>
          <tr>
            <Th>Load case</Th>
            <Th>Limit</Th>
            <Th className="text-right">Bare structure</Th>
            <Th className="text-right">With damper</Th>
            <Th>Use of limit</Th>
            <Th className="text-right">Damper stroke</Th>
            <Th>Verdict</Th>
          </tr>
        </thead>
        <tbody>
          {result.loadCases.map((loadCase) => {
            const governing = loadCase.loadCaseId === result.governing.loadCaseId;
            return (
              <tr key={loadCase.loadCaseId} data-load-case={loadCase.name}>
                <Td>
                  <span className="font-semibold">{loadCase.name}</span>
                  {governing && result.loadCases.length > 1 ? (
                    <span className="ml-2 rounded-pill bg-ink px-2 py-0.5 text-[0.7rem] font-semibold uppercase tracking-[0.06em] text-paper-raised">governs</span>
                  ) : null}
                  <div className="line-clamp-2 max-w-[18rem] text-caption text-ink-muted" title={loadCase.loadModel.source}>
                    {loadCase.loadModel.source}
                  </div>
                </Td>
                <Td>
                  {loadCase.criterion ? (
                    <>
                      <div className="whitespace-nowrap tabular-nums">{units.format('acceleration', loadCase.criterion.limitMPerS2, 3)}</div>
                      <div className="text-caption text-ink-muted">{loadCase.criterion.set === 'custom' ? 'custom' : `${loadCase.criterion.set} ${loadCase.criterion.class}`}</div>
                    </>
                  ) : (
                    '—'
                  )}
                </Td>
                <Td className="whitespace-nowrap text-right tabular-nums">
                  {units.format('acceleration', loadCase.bareStructurePeakAccelerationMPerS2, 3)}
                  <div className="text-caption text-ink-muted">at {formatNumber(loadCase.bareStructureAtFrequencyHz, 4)} Hz</div>
                </Td>
                <Td className="whitespace-nowrap text-right font-semibold tabular-nums">
                  {units.format('acceleration', loadCase.peakAccelerationMPerS2, 3)}
                  <div className="text-caption font-normal text-ink-muted">at {formatNumber(loadCase.atFrequencyHz, 4)} Hz</div>
                </Td>
                <Td>
                  <UtilisationBar utilisation={loadCase.utilisation} />
                </Td>
                <Td className="text-right tabular-nums">
                  {units.format('displacement', strokeOf(loadCase), 3)}
                  {loadCase.hardware[0]?.strokeLimitM ? (
                    <div className={`text-caption ${loadCase.hardware[0].strokeWithinLimit === false ? 'font-semibold text-ember-700' : 'text-ink-muted'}`}>
                      design {units.format('displacement', loadCase.hardware[0].designStrokeM, 3)} of {units.format('displacement', loadCase.hardware[0].strokeLimitM, 3)} travel
                    </div>
                  ) : null}
                </Td>
                <Td>
                  <VerdictTag verdict={loadCase.verdict} />
                </Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
      <CriteriaNotes result={result} />
    </div>
  );
}

/** The source and caution of each distinct limit (the guide's words on what was and was not checked). */
function CriteriaNotes({ result }: { result: VariantComputation }) {
  const seen = new Map<string, { label: string; source: string; caution: string }>();
  for (const loadCase of result.loadCases) {
    const c = loadCase.criterion;
    if (c && !seen.has(c.label)) seen.set(c.label, { label: c.label, source: c.source, caution: c.caution });
  }
  if (seen.size === 0) return null;
  return (
    <dl className="flex flex-col gap-2 rounded-plate bg-paper px-4 py-3 text-small">
      {[...seen.values()].map((c) => (
        <div key={c.label}>
          <dt className="font-semibold text-ink">{c.label}</dt>
          <dd className="text-ink-soft">Source: {c.source}</dd>
          <dd className="text-ink-muted">{c.caution}</dd>
        </div>
      ))}
    </dl>
  );
}

/** The worst the damper does while the structure's frequency (and, when given, its damping) moves within tolerance. */
export function DetuningSummary({ result }: { result: VariantComputation }) {
  const units = useDisplayUnits();
  const d = result.detuning;
  const loadCaseName = (id: string) => result.loadCases.find((lc) => lc.loadCaseId === id)?.name ?? id;
  return (
    <dl className="grid gap-x-6 gap-y-3 text-small sm:grid-cols-2 lg:grid-cols-4">
      <Fact label="Structure frequency band">
        {formatNumber(d.structureFrequencyRangeHz[0], 4)}–{formatNumber(d.structureFrequencyRangeHz[1], 4)} Hz (±{formatPercent(d.structureFrequencyToleranceRatio, 3)})
      </Fact>
      <Fact label="Damper damping tolerance">{d.tmdDampingToleranceRatio === null ? 'none given' : `±${formatPercent(d.tmdDampingToleranceRatio, 3)}`}</Fact>
      <Fact label="Worst detuned peak">
        <span className="font-semibold">{units.format('acceleration', d.worstPeakAccelerationMPerS2, 3)}</span> ({Math.round(d.worstUtilisation * 100)} % of the limit)
      </Fact>
      <Fact label="Where it occurs">
        {formatNumber(d.atStructureFrequencyHz, 4)} Hz, damper ζ {formatPercent(d.atTmdDampingRatio, 3)}, {loadCaseName(d.loadCaseId)}
      </Fact>
      <Fact label="Over the band">
        <VerdictTag verdict={d.verdict} size="small" />
      </Fact>
    </dl>
  );
}

export function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5">
      <dt className="text-caption font-semibold uppercase tracking-[0.06em] text-ink-muted">{label}</dt>
      <dd className="text-ink">{children}</dd>
    </div>
  );
}

/** The hardware numbers of the damper, for the load case that needs the most travel. */
export function HardwareFigures({ result }: { result: VariantComputation }) {
  const units = useDisplayUnits();
  const governing = governingHardware(result);
  if (!governing) return <p className="text-small text-ink-muted">No hardware numbers: no load case gave a damper stroke.</p>;
  const h = governing.entry;
  const rows: [string, React.ReactNode][] = [
    ['Moving mass', `${units.format('mass', h.movingMassKg)} in total; ${units.format('mass', h.perUnit.movingMassKg)} per unit × ${h.unitCount}`],
    ['Damper frequency', `${formatNumber(h.frequencyHz, 4)} Hz`],
    ['Damping ratio', `${formatPercent(h.dampingRatio, 3)} of critical, referred to the damper's own frequency ${formatNumber(h.frequencyHz, 4)} Hz`],
    [
      'Spring rate',
      `${units.format('stiffness', h.springRateNPerM)} in total; ${units.format('stiffness', h.perUnit.springRateNPerM)} per unit; ${units.format('stiffness', h.perUnit.springRatePerSpringNPerM)} per spring (${h.springsPerUnit} springs per unit)`,
    ],
    ['Damper coefficient', `${units.format('damping', h.damperCoefficientNsPerM)} in total; ${units.format('damping', h.perUnit.damperCoefficientNsPerM)} per unit`],
    ['Static deflection', `${units.format('displacement', h.staticDeflectionM)} under the moving mass (g/ω²)`],
    [
      'Stroke',
      `${units.format('displacement', h.maximumStrokeM, 3)} computed (${governing.loadCaseName}); design ${units.format('displacement', h.designStrokeM, 3)} (×${formatNumber(h.strokeMarginFactor, 3)})${
        h.strokeLimitM ? `; hardware travel ${units.format('displacement', h.strokeLimitM, 3)}` : ''
      }`,
    ],
    [
      'Tuning range',
      `${formatNumber(h.tuningRange.minFrequencyHz, 4)}–${formatNumber(h.tuningRange.maxFrequencyHz, 4)} Hz (±${formatPercent(h.tuningRange.ratio, 3)}): springs ${units.format('stiffness', h.tuningRange.minSpringRateNPerM)}–${units.format('stiffness', h.tuningRange.maxSpringRateNPerM)}, or moving mass ${units.format('mass', h.tuningRange.minMovingMassKg)}–${units.format('mass', h.tuningRange.maxMovingMassKg)}`,
    ],
  ];
  return (
    <dl className="divide-y divide-paper-line text-small">
      {rows.map(([label, value]) => (
        <div key={label} className="grid gap-1 py-2 sm:grid-cols-[12rem_minmax(0,1fr)]">
          <dt className="font-semibold text-ink-soft">{label}</dt>
          <dd className="tabular-nums text-ink">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** Every warning of the result once, with the load cases it came from. */
export function ResultWarnings({ result }: { result: VariantComputation }) {
  const byMessage = new Map<string, string[]>();
  for (const w of result.warnings) byMessage.set(w.message, byMessage.get(w.message) ?? []);
  for (const loadCase of result.loadCases) {
    for (const w of loadCase.warnings) {
      const list = byMessage.get(w.message) ?? [];
      list.push(loadCase.name);
      byMessage.set(w.message, list);
    }
  }
  if (byMessage.size === 0) return null;
  return (
    <Panel title="Warnings">
      <ul className="flex flex-col gap-2 text-small">
        {[...byMessage.entries()].map(([message, cases]) => (
          <li key={message} className="flex gap-2 rounded-plate border-l-4 border-ember-500 bg-ember-50 px-3 py-2 text-ink">
            <span aria-hidden="true" className="font-bold text-ember-700">!</span>
            <span>
              {message.charAt(0).toUpperCase() + message.slice(1)}
              {cases.length ? <span className="text-ink-muted"> — {cases.join(', ')}</span> : null}
            </span>
          </li>
        ))}
      </ul>
    </Panel>
  );
}
