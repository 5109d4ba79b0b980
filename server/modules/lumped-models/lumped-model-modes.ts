/**
 * The undamped modes of a stored lumped model (the engine's solveModes: ascending frequencies, mass-normalised
 * shapes) and the structural mode a damper at one DOF sees in one of them.
 */
import { HttpError } from '../../lib/http-error';
import { solveModes, type ModalSolution } from '../../../shared/engine/modal';
import { EngineInputError } from '../../../shared/engine/linalg';
import { lumpedMatrixIssues, type LumpedModel } from '../../../shared/contracts/model';
import { designStructureSchema } from '../../../shared/contracts/compute-design';
import type { ApiIssue } from '../../../shared/contracts/errors';

/**
 * |φ| at the damper's DOF at or below this fraction of the shape's largest |φ| is a node of the mode: a damper
 * there does not see it (its modal mass 1/φ² would be unbounded).
 */
export const NODE_TOLERANCE = 1e-6;

const engineFieldNames: Record<string, string> = { massKg: 'massMatrixKg', stiffnessNPerM: 'stiffnessMatrixNPerM' };

/**
 * Checks a pair of matrices (and the DOF labels) with the engine's `modes` rules, then solves them: M must be
 * positive definite and K positive semi-definite. Throws 400 naming the field otherwise.
 */
export function solveLumpedModel(massMatrixKg: number[][], stiffnessMatrixNPerM: number[][], dofLabels: string[] | null | undefined): ModalSolution {
  const issues: ApiIssue[] = lumpedMatrixIssues({ massMatrixKg, stiffnessMatrixNPerM }).map((issue) => {
    const path = issue.path.map(String).join('.');
    return { path, message: `${path}: ${issue.message}` };
  });
  if (issues.length === 0 && dofLabels && dofLabels.length !== massMatrixKg.length) {
    issues.push({ path: 'dofLabels', message: `dofLabels: must have ${massMatrixKg.length} labels, one per DOF (got ${dofLabels.length})` });
  }
  if (issues.length > 0) throw new HttpError(400, 'invalid_request', issues.length === 1 ? issues[0].message : `${issues.length} fields are invalid`, issues);
  try {
    return solveModes(massMatrixKg, stiffnessMatrixNPerM);
  } catch (error) {
    if (!(error instanceof EngineInputError)) throw error;
    const [head, ...rest] = error.field.split('.');
    const path = [engineFieldNames[head] ?? head, ...rest].join('.');
    const message = `${path}: ${error.message.replace(/^[^:]*:\s*/, '')}`;
    throw new HttpError(400, 'invalid_request', message, [{ path, message }]);
  }
}

/** The `modes` of a lumped model's answer. */
export function modesOf(solution: ModalSolution): LumpedModel['modes'] {
  return solution.shapes.map((shape, r) => ({
    frequencyHz: solution.frequencyHz[r],
    angularFrequencyRadPerS: solution.angularFrequencyRadPerS[r],
    shape: [...shape],
  }));
}

export type LumpedModeDerivation =
  | { ok: true; frequencyHz: number; modalMassKg: number }
  | { ok: false; field: 'modeNumber' | 'dofIndex'; message: string };

/**
 * Mode `modeNumber` (1-based, ascending frequency) seen from DOF `dofIndex` (0-based): its frequency, and the modal
 * mass of the shape scaled to 1 at that DOF. With φ mass-normalised (φᵀMφ = 1), ψ = φ/φ_d has ψᵀMψ = 1/φ_d².
 */
export function deriveFromLumpedModel(solution: ModalSolution, modeNumber: number, dofIndex: number): LumpedModeDerivation {
  const n = solution.dofCount;
  if (modeNumber > n) return { ok: false, field: 'modeNumber', message: `must be at most ${n} (the model has ${n} modes)` };
  if (dofIndex >= n) return { ok: false, field: 'dofIndex', message: `must be at most ${n - 1} (the model has ${n} DOFs, counted from 0)` };
  const r = modeNumber - 1;
  const frequencyHz = solution.frequencyHz[r];
  if (!(frequencyHz > 0)) return { ok: false, field: 'modeNumber', message: `is a rigid-body mode (0 Hz): a damper cannot be tuned to it` };
  const shape = solution.shapes[r];
  const largest = shape.reduce((max, value) => Math.max(max, Math.abs(value)), 0);
  const atDof = shape[dofIndex];
  if (Math.abs(atDof) <= NODE_TOLERANCE * largest) {
    return { ok: false, field: 'dofIndex', message: `is a node of mode ${modeNumber} (φ ≈ 0 there): a damper at this DOF does not move in that mode` };
  }
  const modalMassKg = 1 / (atDof * atDof);
  const outside = derivedNumbersProblem(frequencyHz, modalMassKg);
  if (outside) return { ok: false, field: outside.field === 'frequencyHz' ? 'modeNumber' : 'dofIndex', message: outside.message };
  return { ok: true, frequencyHz, modalMassKg };
}

/**
 * A derived frequency or modal mass outside the ranges the engine accepts for a mode (its structure-mode schema),
 * named and worded; null when both are inside.
 */
export function derivedNumbersProblem(frequencyHz: number, modalMassKg: number): { field: 'frequencyHz' | 'modalMassKg'; message: string } | null {
  const fields = designStructureSchema.shape;
  const frequency = fields.frequencyHz.safeParse(frequencyHz);
  if (!frequency.success) return { field: 'frequencyHz', message: `gives a frequency of ${frequencyHz} Hz, which ${frequency.error.issues[0].message}` };
  const mass = fields.modalMassKg.safeParse(modalMassKg);
  if (!mass.success) return { field: 'modalMassKg', message: `gives a modal mass of ${modalMassKg} kg, which ${mass.error.issues[0].message}` };
  return null;
}
