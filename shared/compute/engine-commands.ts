import type { ComputeCommand } from './types';
import { ComputeInputError } from './types';
import {
  freeRequestSchema,
  freeResponseSchema,
  modesRequestSchema,
  modesResponseSchema,
  responseRequestSchema,
  responseResponseSchema,
  tuneRequestSchema,
  tuneResponseSchema,
  type FreeRequest,
  type FreeResponse,
  type ModesRequest,
  type ModesResponse,
  type ResponseRequest,
  type ResponseResponse,
  type TuneRequestParsed,
  type TuneResponse,
} from '../contracts/compute';
import { EngineInputError } from '../engine/linalg';
import { solveModes } from '../engine/modal';
import { solveFreeVibration } from '../engine/free-vibration';
import { tuneTmd } from '../engine/tuning';
import { createModeTmdPoint, createModeTmdSystem, evaluateModeTmdSystem, findResponsePeak } from '../engine/response';

/** Engine argument names → request field names, for the error path. */
const fieldNames: Record<string, string> = {
  massKg: 'massMatrixKg',
  stiffnessNPerM: 'stiffnessMatrixNPerM',
};

function renameField(field: string): string {
  const [head, ...rest] = field.split('.');
  return [fieldNames[head] ?? head, ...rest].join('.');
}

/** Runs engine code, turning its input errors into ComputeInputError with the request's field names. */
function withInputErrors<T>(run: () => T): T {
  try {
    return run();
  } catch (error) {
    if (error instanceof EngineInputError) {
      const path = renameField(error.field);
      const head = error.field.split('.')[0];
      const message = error.message.startsWith(`${head}:`) ? `${renameField(head)}:${error.message.slice(head.length + 1)}` : error.message;
      throw new ComputeInputError(message, [{ path, message }]);
    }
    throw error;
  }
}

export const modesCommand: ComputeCommand<ModesRequest, ModesResponse> = {
  name: 'modes',
  summary: 'Undamped modes of an n-DOF system (mass and stiffness matrices): frequencies and mass-normalised shapes.',
  request: modesRequestSchema,
  response: modesResponseSchema,
  run(request) {
    const solution = withInputErrors(() => solveModes(request.massMatrixKg, request.stiffnessMatrixNPerM));
    return {
      modes: solution.shapes.map((shape, i) => ({
        frequencyHz: solution.frequencyHz[i],
        angularFrequencyRadPerS: solution.angularFrequencyRadPerS[i],
        shape,
      })),
    };
  },
};

export const tuneCommand: ComputeCommand<TuneRequestParsed, TuneResponse> = {
  name: 'tune',
  summary: 'Optimum tuning of one TMD: den-hartog, warburton-random, ioi-ikeda, hinf or h2.',
  request: tuneRequestSchema,
  response: tuneResponseSchema,
  run(request) {
    return withInputErrors(() => tuneTmd(request.method, request.massRatio, request.structureFrequencyHz, request.structureDampingRatio));
  },
};

export const responseCommand: ComputeCommand<ResponseRequest, ResponseResponse> = {
  name: 'response',
  summary: 'Steady-state response of a structure mode with TMDs to a harmonic force, and its continuous acceleration peak.',
  request: responseRequestSchema,
  response: responseResponseSchema,
  run(request) {
    const system = withInputErrors(() => createModeTmdSystem(request.structure, request.tmds));
    const point = createModeTmdPoint(system);
    const force = request.forceAmplitudeN;
    let lo = Infinity;
    let hi = -Infinity;
    const points = request.frequenciesHz.map((frequencyHz, i) => {
      lo = Math.min(lo, frequencyHz);
      hi = Math.max(hi, frequencyHz);
      evaluateModeTmdSystem(system, frequencyHz, point);
      if (!Number.isFinite(point.structureDisplacementMPerN)) {
        const message = `frequenciesHz: ${frequencyHz} Hz is a natural frequency of the undamped system, where the steady-state response is unbounded; give a damping ratio greater than 0`;
        throw new ComputeInputError(message, [{ path: `frequenciesHz.${i}`, message }]);
      }
      return {
        frequencyHz,
        structureDisplacementM: point.structureDisplacementMPerN * force,
        structureAccelerationMPerS2: point.structureAccelerationMPerS2PerN * force,
        tmdStrokeM: Array.from(point.tmdStrokeMPerN, (stroke) => stroke * force),
      };
    });
    const peak = findResponsePeak(system, [lo, hi], { quantity: 'structureAcceleration' });
    if (!Number.isFinite(peak.value)) {
      const message = `frequenciesHz: the band ${lo}–${hi} Hz contains the natural frequency ${peak.frequencyHz} Hz of the undamped system, where the steady-state response is unbounded; give a damping ratio greater than 0`;
      throw new ComputeInputError(message, [{ path: 'frequenciesHz', message }]);
    }
    return { points, peak: { frequencyHz: peak.frequencyHz, structureAccelerationMPerS2: peak.value * force } };
  },
};

export const freeCommand: ComputeCommand<FreeRequest, FreeResponse> = {
  name: 'free',
  summary: 'Free vibration of an undamped n-DOF system from initial displacement and velocity, by modal superposition.',
  request: freeRequestSchema,
  response: freeResponseSchema,
  run(request) {
    const result = withInputErrors(() =>
      solveFreeVibration({
        massKg: request.massMatrixKg,
        stiffnessNPerM: request.stiffnessMatrixNPerM,
        initialDisplacementM: request.initialDisplacementM,
        initialVelocityMPerS: request.initialVelocityMPerS,
        timesS: request.timesS,
      }),
    );
    const n = result.dofCount;
    const displacementsM: number[][] = [];
    for (let t = 0; t < request.timesS.length; t++) displacementsM.push(Array.from(result.displacementM.subarray(t * n, (t + 1) * n)));
    return { displacementsM };
  },
};

/** modes, tune, response, free. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- a registry of commands with different request types
export const engineCommands: Record<string, ComputeCommand<any, any>> = {
  modes: modesCommand,
  tune: tuneCommand,
  response: responseCommand,
  free: freeCommand,
};
