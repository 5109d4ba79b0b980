import type { SiteRecordCondition } from '../../../../shared/contracts/site-records';

export const conditionLabels: Record<SiteRecordCondition, string> = {
  'without-damper': 'Without damper',
  'with-damper': 'With damper working',
  'damper-locked': 'Damper locked',
};

export const methodLabels = { spectrum: 'Spectrum (ambient response)', decay: 'Free decay' } as const;

export const tuningMethodLabels: Record<string, string> = {
  'den-hartog': 'Den Hartog (harmonic force)',
  'warburton-random': 'Warburton (random force)',
  'ioi-ikeda': 'Ioi–Ikeda (damped structure)',
  hinf: 'H∞ optimum (numerical)',
  h2: 'H2 optimum (numerical)',
};
