import { useMemo, useState } from 'react';
import type { ModalSolution } from '../../../../shared/engine/modal';
import { TimeHistoryChart } from '../../../components/charts/lazy-charts';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import { Unit } from '../../../components/ui/unit';
import { formatNumber } from '../../../lib/format';
import { computeFreeVibration, defaultDurationS, dofName, FREE_VIBRATION_PERIODS, type ModelMatrices } from './lumped-model-analysis';

interface FreeVibrationPanelProps {
  matrices: ModelMatrices;
  modes: ModalSolution;
  dofLabels: readonly string[];
}

const parse = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

/**
 * The undamped free vibration of the model from displacements and velocities at t = 0, by the engine's modal
 * superposition. The initial conditions are for looking only: nothing here is stored.
 */
export function FreeVibrationPanel({ matrices, modes, dofLabels }: FreeVibrationPanelProps) {
  const n = matrices.massMatrixKg.length;
  const [displacementText, setDisplacementText] = useState<string[]>(() => ['0.01']);
  const [velocityText, setVelocityText] = useState<string[]>(() => []);
  const [durationText, setDurationText] = useState('');

  const displacement = Array.from({ length: n }, (_, i) => parse(displacementText[i] ?? '0'));
  const velocity = Array.from({ length: n }, (_, i) => parse(velocityText[i] ?? '0'));
  const autoDurationS = defaultDurationS(modes);
  const durationS = durationText.trim() === '' ? autoDurationS : Number(durationText);
  const key = JSON.stringify([matrices, displacement, velocity, durationS]);
  // eslint-disable-next-line react-hooks/exhaustive-deps -- the key holds every input of the computation
  const result = useMemo(() => computeFreeVibration(matrices, displacement, velocity, durationS), [key]);

  const setEntry = (setter: typeof setDisplacementText, index: number, value: string) =>
    setter((current) => {
      const next = [...current];
      while (next.length < n) next.push('0');
      next[index] = value;
      return next;
    });

  return (
    <Panel
      title="Free vibration"
      description="The model set moving by displacements and velocities at t = 0 and left alone, without damping: the sum of its modes. Try initial conditions here; they are not stored."
    >
      <div className="flex flex-col gap-5">
        <div className="overflow-x-auto">
          <table className="text-small">
            <caption className="sr-only">Initial conditions</caption>
            <thead>
              <tr>
                <th scope="col" className="px-2 pb-1 text-left text-caption font-semibold uppercase tracking-[0.08em] text-ink-muted">
                  Degree of freedom
                </th>
                <th scope="col" className="px-2 pb-1 text-left text-caption font-semibold uppercase tracking-[0.08em] text-ink-muted">
                  <span className="normal-case">x(0)</span> <Unit>m</Unit>
                </th>
                <th scope="col" className="px-2 pb-1 text-left text-caption font-semibold uppercase tracking-[0.08em] text-ink-muted">
                  <span className="normal-case">ẋ(0)</span> <Unit>m/s</Unit>
                </th>
              </tr>
            </thead>
            <tbody>
              {Array.from({ length: n }, (_, i) => (
                <tr key={i}>
                  <th scope="row" className="px-2 py-1 text-left font-medium text-ink-soft">
                    {dofName(dofLabels, i)}
                  </th>
                  <td className="px-2 py-1">
                    <input
                      aria-label={`Initial displacement of ${dofName(dofLabels, i)} [m]`}
                      inputMode="decimal"
                      className="w-32 rounded-plate border border-paper-line bg-paper-raised px-2 py-1 text-right tabular-nums"
                      value={displacementText[i] ?? '0'}
                      onChange={(event) => setEntry(setDisplacementText, i, event.target.value)}
                    />
                  </td>
                  <td className="px-2 py-1">
                    <input
                      aria-label={`Initial velocity of ${dofName(dofLabels, i)} [m/s]`}
                      inputMode="decimal"
                      className="w-32 rounded-plate border border-paper-line bg-paper-raised px-2 py-1 text-right tabular-nums"
                      value={velocityText[i] ?? '0'}
                      onChange={(event) => setEntry(setVelocityText, i, event.target.value)}
                    />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <label className="flex max-w-xs flex-col gap-1 text-small font-semibold text-ink-soft">
          Duration [s]
          <input
            inputMode="decimal"
            placeholder={formatNumber(autoDurationS, 3)}
            className="rounded-plate border border-paper-line bg-paper-raised px-3 py-2 font-normal tabular-nums"
            value={durationText}
            onChange={(event) => setDurationText(event.target.value)}
          />
          <span className="text-caption font-normal text-ink-muted">
            Left blank: {FREE_VIBRATION_PERIODS} periods of the lowest mode ({formatNumber(autoDurationS, 3)} s).
          </span>
        </label>
        {result.ok ? (
          <TimeHistoryChart
            timesS={result.plot.timesS}
            series={result.plot.displacementM.map((values, i) => ({ label: dofName(dofLabels, i), values }))}
            valueAxisLabel="displacement [m]"
            description={`Displacement of each degree of freedom over ${formatNumber(result.plot.durationS, 3)} s, undamped, from the initial conditions above.`}
          />
        ) : (
          <Notice tone="caution" title="No plot yet">
            {result.problem}
          </Notice>
        )}
      </div>
    </Panel>
  );
}
