/**
 * Mass, damping and stiffness matrices of one structure mode with n TMDs attached at the same point.
 * DOF 0 is the structure's modal coordinate, DOF 1 + j is damper j's absolute displacement; row-major n×n.
 */
import type { StructureMode, TmdParameters } from './types';
import { createModeTmdSystem } from './response';

export interface LinearSystemMatrices {
  dofCount: number;
  massKg: Float64Array;
  dampingNsPerM: Float64Array;
  stiffnessNPerM: Float64Array;
}

export function buildModeTmdMatrices(structure: StructureMode, tmds: readonly TmdParameters[]): LinearSystemMatrices {
  const system = createModeTmdSystem(structure, tmds); // validates
  const n = tmds.length + 1;
  const massKg = new Float64Array(n * n);
  const dampingNsPerM = new Float64Array(n * n);
  const stiffnessNPerM = new Float64Array(n * n);
  massKg[0] = system.structureMassKg;
  stiffnessNPerM[0] = system.structureStiffnessNPerM;
  dampingNsPerM[0] = system.structureDampingNsPerM;
  for (let j = 0; j < tmds.length; j++) {
    const d = j + 1;
    const k = system.tmdStiffnessNPerM[j];
    const c = system.tmdDampingNsPerM[j];
    massKg[d * n + d] = system.tmdMassKg[j];
    stiffnessNPerM[0] += k;
    stiffnessNPerM[d * n + d] = k;
    stiffnessNPerM[d] = -k;
    stiffnessNPerM[d * n] = -k;
    dampingNsPerM[0] += c;
    dampingNsPerM[d * n + d] = c;
    dampingNsPerM[d] = -c;
    dampingNsPerM[d * n] = -c;
  }
  return { dofCount: n, massKg, dampingNsPerM, stiffnessNPerM };
}
