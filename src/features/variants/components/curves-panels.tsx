import type { VariantCurves } from '../../../../shared/contracts';
import { FrequencyResponseChart, HeatMapChart, TimeHistoryChart } from '../../../components/charts/lazy-charts';
import { useDisplayUnits } from '../../../lib/display-units';
import { formatNumber, formatPercent } from '../../../lib/format';

/** The bands of a load case joined on one frequency axis, a gap (NaN) between bands that do not touch. */
export function joinBands(curves: VariantCurves) {
  const bands = [...curves.response].sort((a, b) => a.loHz - b.loHz);
  const frequenciesHz: number[] = [];
  const withDamper: number[] = [];
  const bare: number[] = [];
  const stroke: number[] = [];
  // The limit at each frequency, for criteria whose limit depends on frequency (null: one limit for all).
  const varyingLimit = bands.length > 0 && bands.every((band) => band.limitMPerS2) ? ([] as number[]) : null;
  bands.forEach((band, b) => {
    if (b > 0) {
      frequenciesHz.push((bands[b - 1].hiHz + band.loHz) / 2);
      withDamper.push(NaN);
      bare.push(NaN);
      stroke.push(NaN);
      varyingLimit?.push(NaN);
    }
    for (let i = 0; i < band.frequencyHz.length; i++) {
      frequenciesHz.push(band.frequencyHz[i]);
      withDamper.push(band.accelerationMPerS2[i]);
      bare.push(band.bareStructureAccelerationMPerS2[i] ?? NaN);
      stroke.push(band.tmdStrokeM[i]);
      varyingLimit?.push(band.limitMPerS2?.[i] ?? NaN);
    }
  });
  return { frequenciesHz, withDamper, bare, stroke, varyingLimit, bandsHz: bands.map((band) => [band.loHz, band.hiHz] as const) };
}

interface CurvesPanelsProps {
  curves: VariantCurves;
  /** The hardware's travel, m, when one is given. */
  strokeLimitM?: number | null;
  /** Half-width of the detuning band and of the damping tolerance, as fractions (the outlined region of the map). */
  structureFrequencyToleranceRatio: number;
  tmdDampingToleranceRatio?: number | null;
  /** The structure's own frequency (the design point of the map). */
  structureFrequencyHz: number;
}

/** Response with and without the damper, the damper's stroke, the robustness map — or the moving walker's history. */
export function CurvesPanels({ curves, strokeLimitM, structureFrequencyToleranceRatio, tmdDampingToleranceRatio, structureFrequencyHz }: CurvesPanelsProps) {
  const units = useDisplayUnits();
  const a = (v: number) => units.toDisplay('acceleration', v);
  const accelerationLabel = `peak acceleration [${units.label('acceleration')}]`;
  const limit = { value: a(curves.limitMPerS2), label: `comfort limit ${units.format('acceleration', curves.limitMPerS2, 3)}` };

  if (curves.timeHistory) {
    const history = curves.timeHistory;
    return (
      <section aria-label="Moving walker" className="flex flex-col gap-3">
        <h3 className="text-body font-semibold text-ink">One walker crossing the span</h3>
        <TimeHistoryChart
          timesS={history.timesS}
          series={[
            { label: 'with damper', values: history.structureAccelerationMPerS2.map(a) },
            { label: 'bare structure', values: history.bareStructureAccelerationMPerS2.map(a) },
            { label: 'running 1-s r.m.s. with damper', values: history.runningRms1sMPerS2.map(a) },
          ]}
          valueAxisLabel={`acceleration [${units.label('acceleration')}]`}
          description={`Structure acceleration while one walker crosses: peak ${units.format('acceleration', history.peakAccelerationMPerS2, 3)} with the damper, ${units.format('acceleration', history.bareStructurePeakAccelerationMPerS2, 3)} without (every ${history.decimation} steps shown, keeping each stretch's largest value).`}
        />
      </section>
    );
  }

  const joined = joinBands(curves);
  const map = curves.robustness;
  return (
    <div className="flex flex-col gap-8">
      <section aria-label="Response over the pacing band" className="flex flex-col gap-2">
        <h3 className="text-body font-semibold text-ink">Response over the loaded band</h3>
        <FrequencyResponseChart
          frequenciesHz={joined.frequenciesHz}
          series={[
            { label: 'with damper', values: joined.withDamper.map(a), colourIndex: 0 },
            { label: 'bare structure', values: joined.bare.map(a), muted: true },
            ...(joined.varyingLimit ? [{ label: 'comfort limit at each frequency', values: joined.varyingLimit.map(a), colourIndex: 4 }] : []),
          ]}
          limit={joined.varyingLimit ? null : limit}
          bandsHz={joined.bandsHz}
          valueAxisLabel={accelerationLabel}
          description={`Peak acceleration at each force frequency of ${curves.name}, with the damper and without; the shaded bands are the ones the load case loads, the dashed rule the comfort limit. Peak with the damper ${
            curves.peak ? `${units.format('acceleration', curves.peak.accelerationMPerS2, 3)} at ${formatNumber(curves.peak.frequencyHz, 4)} Hz` : '—'
          }.`}
        />
      </section>
      <section aria-label="Damper stroke" className="flex flex-col gap-2">
        <h3 className="text-body font-semibold text-ink">Damper stroke</h3>
        <FrequencyResponseChart
          height="short"
          frequenciesHz={joined.frequenciesHz}
          series={[{ label: 'stroke (damper relative to the structure)', values: joined.stroke.map((v) => units.toDisplay('displacement', v)), colourIndex: 1 }]}
          limit={strokeLimitM ? { value: units.toDisplay('displacement', strokeLimitM), label: `hardware travel ${units.format('displacement', strokeLimitM, 3)}` } : null}
          bandsHz={joined.bandsHz}
          valueAxisLabel={`stroke amplitude [${units.label('displacement')}]`}
          description="Amplitude of the damper's movement relative to the structure at each force frequency (zero to peak)."
        />
      </section>
      {map ? (
        <section aria-label="Robustness map" className="flex flex-col gap-2">
          <h3 className="text-body font-semibold text-ink">Robustness: structure frequency × damper damping</h3>
          <HeatMapChart
            xs={map.structureFrequencyHz}
            ys={map.tmdDampingRatio}
            values={map.peakAccelerationMPerS2.flat().map(a)}
            limit={a(map.limitMPerS2)}
            marker={{ x: structureFrequencyHz, y: curves.tmd.dampingRatio }}
            region={{
              x0: structureFrequencyHz * (1 - structureFrequencyToleranceRatio),
              x1: structureFrequencyHz * (1 + structureFrequencyToleranceRatio),
              y0: curves.tmd.dampingRatio * (1 - (tmdDampingToleranceRatio ?? 0)),
              y1: curves.tmd.dampingRatio * (1 + (tmdDampingToleranceRatio ?? 0)),
            }}
            xAxisLabel="structure frequency [Hz]"
            yAxisLabel="damper damping ratio"
            valueLabel={`peak [${units.label('acceleration')}]`}
            formatY={(v) => formatPercent(v, 3)}
            description={`Peak acceleration of ${curves.name} as the structure's frequency and the damper's damping ratio move away from the design (ring); the dashed frame is the detuning band${
              tmdDampingToleranceRatio ? ' and damping tolerance' : ''
            }. Cells turn from tide to ember where the peak passes the comfort limit.`}
          />
        </section>
      ) : null}
    </div>
  );
}
