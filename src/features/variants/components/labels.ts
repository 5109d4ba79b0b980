import type { TuningMethod, VariantTuning } from '../../../../shared/contracts';

/** The published tuning methods by their authors' names; numerical optima by what they minimise. */
export const tuningMethodLabels: Record<TuningMethod, string> = {
  'den-hartog': 'Den Hartog (1956), harmonic force',
  'warburton-random': 'Warburton (1982), white-noise force',
  'ioi-ikeda': 'Ioi & Ikeda (1978), damped structure',
  hinf: 'Numerical H∞ (least peak response)',
  h2: 'Numerical H2 (least mean-square response)',
};

export const tuningMethodShortLabels: Record<TuningMethod, string> = {
  'den-hartog': 'Den Hartog',
  'warburton-random': 'Warburton',
  'ioi-ikeda': 'Ioi & Ikeda',
  hinf: 'H∞',
  h2: 'H2',
};

export function describeTuning(tuning: VariantTuning): string {
  return 'method' in tuning ? tuningMethodShortLabels[tuning.method] : 'set by hand';
}
