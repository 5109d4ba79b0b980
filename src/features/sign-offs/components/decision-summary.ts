import type { VariantResult } from '../../../../shared/contracts/variants';
import { formatPercent } from '../../../lib/format';

/**
 * The decision asked of the owner in one or two plain sentences, from the snapshot's result: whether the damper keeps
 * every load case within its limit, the least margin, whether it still does when the structure is not quite as
 * modelled, and how many warnings the engine raised. `tone` says whether everything holds.
 */
export function decisionSummary(
  result: Pick<VariantResult, 'loadCases' | 'detuning' | 'warnings'>,
  loadCaseName: (id: string) => string,
): { tone: 'meets' | 'exceeds'; sentences: string[] } {
  const checked = result.loadCases.filter((lc) => lc.verdict !== undefined && lc.utilisation !== undefined);
  const failing = checked.filter((lc) => lc.verdict === 'fail');
  const sentences: string[] = [];
  if (checked.length === 0) {
    sentences.push('No load case has a limit to check against: the comfort criteria set none for these load cases.');
  } else if (failing.length === 0) {
    const least = checked.reduce((a, b) => ((b.utilisation ?? 0) > (a.utilisation ?? 0) ? b : a));
    sentences.push(
      `With this damper the peak acceleration stays within the limit on ${checked.length === 1 ? 'the one load case' : `all ${checked.length} load cases`}` +
        ` checked; the least margin is ${formatPercent(1 - (least.utilisation ?? 0))} (${least.name}).`,
    );
  } else {
    sentences.push(
      `With this damper the peak acceleration exceeds the limit on ${failing.length} of ${checked.length} load cases checked: ` +
        `${failing.map((lc) => lc.name).join(', ')}.`,
    );
  }
  const detuning = result.detuning;
  const band = `±${formatPercent(detuning.structureFrequencyToleranceRatio)}`;
  sentences.push(
    detuning.verdict === 'pass'
      ? `It still does with the structure's frequency ${band} off the model (least margin ${formatPercent(1 - detuning.worstUtilisation)}).`
      : `With the structure's frequency ${band} off the model it exceeds the limit (${loadCaseName(detuning.loadCaseId)}, margin ${formatPercent(1 - detuning.worstUtilisation)}).`,
  );
  sentences.push(
    result.warnings.length === 0 ? 'The engine raised no warning.' : `The engine raised ${result.warnings.length === 1 ? 'one warning' : `${result.warnings.length} warnings`}: see the warnings below.`,
  );
  return { tone: failing.length === 0 && detuning.verdict === 'pass' ? 'meets' : 'exceeds', sentences };
}
