import { useQueries } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import type { SavedLoadCase, Variant } from '../../../../shared/contracts';
import { FrequencyResponseChart } from '../../../components/charts/lazy-charts';
import { Loading } from '../../../components/ui/loading';
import { Table, Td, Th } from '../../../components/ui/table';
import { useDisplayUnits } from '../../../lib/display-units';
import { formatNumber, formatPercent } from '../../../lib/format';
import { variantCurvesQueryOptions } from '../api/variants';
import { joinBands } from './curves-panels';
import { describeTuning } from './labels';
import { strokeOf } from './result-panels';
import { VerdictTag } from './verdict-tag';

interface Row {
  label: string;
  /** The number compared (smaller is better), or null where the row has nothing to rank. */
  value: (variant: Variant) => number | null;
  show: (variant: Variant) => ReactNode;
}

/** The small mark beside the best value of a row. */
function LeastTag() {
  return (
    <span className="ml-2 inline-flex items-center rounded-pill border border-ink/30 px-1.5 text-[0.68rem] font-semibold uppercase tracking-[0.08em] text-ink-soft" title="The least of the variants compared">
      least
    </span>
  );
}

/** Variants side by side: damper, tuning, governing and detuned peaks, stroke, verdict per load case; curves overlaid. */
export function VariantComparison({ projectId, variants, loadCases }: { projectId: string; variants: readonly Variant[]; loadCases: readonly SavedLoadCase[] }) {
  const units = useDisplayUnits();
  const withResult = variants.filter((v) => v.result);
  const loadCaseIds = [...new Set(variants.flatMap((v) => v.loadCaseIds))];
  const rows: Row[] = [
    { label: 'Mass ratio', value: (v) => v.massRatio, show: (v) => formatPercent(v.massRatio, 3) },
    { label: 'Moving mass', value: (v) => v.result?.tmd.massKg ?? null, show: (v) => units.format('mass', v.result?.tmd.massKg) },
    {
      label: 'Tuning',
      value: () => null,
      show: (v) =>
        v.result ? `${formatNumber(v.result.tmd.frequencyHz, 4)} Hz, ζ ${formatPercent(v.result.tmd.dampingRatio, 3)} (${describeTuning(v.tuning)})` : describeTuning(v.tuning),
    },
    { label: 'Governing peak', value: (v) => v.result?.governing.peakAccelerationMPerS2 ?? null, show: (v) => units.format('acceleration', v.result?.governing.peakAccelerationMPerS2, 3) },
    { label: 'Use of limit', value: (v) => v.result?.governing.utilisation ?? null, show: (v) => (v.result ? `${formatNumber(v.result.governing.utilisation * 100, 3)} %` : '—') },
    {
      label: 'Worst detuned peak',
      value: (v) => v.result?.detuning.worstPeakAccelerationMPerS2 ?? null,
      show: (v) =>
        v.result
          ? `${units.format('acceleration', v.result.detuning.worstPeakAccelerationMPerS2, 3)} (±${formatPercent(v.result.detuning.structureFrequencyToleranceRatio, 2)})`
          : '—',
    },
    {
      label: 'Largest stroke',
      value: (v) => (v.result ? Math.max(0, ...v.result.loadCases.map(strokeOf)) : null),
      show: (v) => (v.result ? units.format('displacement', Math.max(0, ...v.result.loadCases.map(strokeOf)), 3) : '—'),
    },
  ];
  const least = (row: Row): number | null => {
    const numbers = withResult.map(row.value).filter((n): n is number => n !== null);
    return numbers.length > 1 ? Math.min(...numbers) : null;
  };

  return (
    <div className="flex flex-col gap-6">
      <Table caption="Tuning variants compared">
        <thead>
          <tr>
            <Th />
            {variants.map((v) => (
              <Th key={v.id} className="normal-case tracking-normal text-ink">
                {v.name}
              </Th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => {
            const best = least(row);
            return (
              <tr key={row.label}>
                <Th scope="row" className="border-b border-paper-line">
                  {row.label}
                </Th>
                {variants.map((v) => {
                  const value = row.value(v);
                  return (
                    <Td key={v.id} className="tabular-nums" data-least={best !== null && value === best ? 'true' : undefined}>
                      {row.show(v)}
                      {best !== null && value === best ? <LeastTag /> : null}
                    </Td>
                  );
                })}
              </tr>
            );
          })}
          {loadCaseIds.map((id) => {
            const name = loadCases.find((lc) => lc.id === id)?.name ?? 'load case';
            return (
              <tr key={id}>
                <Th scope="row" className="border-b border-paper-line">
                  {name}
                </Th>
                {variants.map((v) => {
                  const lc = v.result?.loadCases.find((entry) => entry.loadCaseId === id);
                  return (
                    <Td key={v.id}>
                      {lc ? (
                        <span className="inline-flex items-center gap-2">
                          <VerdictTag verdict={lc.verdict} size="small" />
                          <span className="tabular-nums text-ink-soft">{units.format('acceleration', lc.peakAccelerationMPerS2, 3)}</span>
                        </span>
                      ) : (
                        <span className="text-ink-muted">not checked</span>
                      )}
                    </Td>
                  );
                })}
              </tr>
            );
          })}
        </tbody>
      </Table>
      <OverlaidCurves projectId={projectId} variants={withResult} loadCases={loadCases} />
    </div>
  );
}

function OverlaidCurves({ projectId, variants, loadCases }: { projectId: string; variants: readonly Variant[]; loadCases: readonly SavedLoadCase[] }) {
  const units = useDisplayUnits();
  // Load cases every compared variant is checked under, steady ones first (a moving walker has no response curve).
  const shared = loadCases.filter((lc) => variants.every((v) => v.loadCaseIds.includes(lc.id)) && lc.spec.kind !== 'moving-walker');
  const [chosen, setChosen] = useState<string | null>(null);
  const loadCaseId = chosen && shared.some((lc) => lc.id === chosen) ? chosen : shared[0]?.id;
  const curves = useQueries({
    queries: loadCaseId ? variants.map((v) => variantCurvesQueryOptions(projectId, v.id, loadCaseId)) : [],
  });
  if (!loadCaseId) return <p className="text-small text-ink-muted">The variants compared share no steady load case to overlay.</p>;
  const ready = curves.every((q) => q.data);
  return (
    <section aria-label="Response curves overlaid" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h3 className="text-body font-semibold text-ink">Response with each damper</h3>
        {shared.length > 1 ? (
          <label className="flex items-center gap-2 text-small text-ink-soft">
            Load case
            <select value={loadCaseId} onChange={(event) => setChosen(event.target.value)} className="rounded-plate border border-paper-line bg-paper-raised px-2 py-1">
              {shared.map((lc) => (
                <option key={lc.id} value={lc.id}>
                  {lc.name}
                </option>
              ))}
            </select>
          </label>
        ) : null}
      </div>
      {!ready ? (
        <Loading label="Computing the curves…" />
      ) : (
        (() => {
          const joined = curves.map((q) => joinBands(q.data!));
          const bare = joined[0];
          const all = joined.flatMap((j) => j.frequenciesHz);
          const frequenciesHz = [Math.min(...all), Math.max(...all)];
          const series = joined.map((j, k) => ({
            label: variants[k].name,
            frequenciesHz: j.frequenciesHz,
            values: j.withDamper.map((v) => units.toDisplay('acceleration', v)),
            colourIndex: k,
          }));
          const first = curves[0].data!;
          return (
            <FrequencyResponseChart
              frequenciesHz={frequenciesHz}
              series={[...series, { label: 'bare structure', frequenciesHz: bare.frequenciesHz, values: bare.bare.map((v) => units.toDisplay('acceleration', v)), muted: true }]}
              limit={{ value: units.toDisplay('acceleration', first.limitMPerS2), label: `comfort limit ${units.format('acceleration', first.limitMPerS2, 3)}` }}
              bandsHz={bare.bandsHz}
              valueAxisLabel={`peak acceleration [${units.label('acceleration')}]`}
              description={`Peak acceleration of ${first.name} at each force frequency, one line per variant, with the bare structure for reference and the comfort limit.`}
            />
          );
        })()
      )}
    </section>
  );
}
