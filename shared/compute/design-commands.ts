import type { ComputeCommand } from './types';
import { ComputeInputError } from './types';
import {
  assessRequestSchema,
  assessResponseSchema,
  robustnessRequestSchema,
  robustnessResponseSchema,
  sizeRequestSchema,
  sizeResponseSchema,
  type AssessRequest,
  type AssessResponse,
  type RobustnessRequest,
  type RobustnessResponse,
  type SizeRequest,
  type SizeResponse,
} from '../contracts/compute-design';
import { assessDesign } from '../engine/design';
import { sizeDamper } from '../engine/sizing';
import { mapRobustness } from '../engine/robustness';
import { LoadCaseError } from '../engine/loads/load-envelope';
import { EngineInputError } from '../engine/linalg';

/** Runs a design computation, turning the engine's refusals into ComputeInputError naming the field. */
function guarded<T>(run: () => T): T {
  try {
    return run();
  } catch (error) {
    if (error instanceof LoadCaseError) {
      throw new ComputeInputError(error.message, [{ path: error.path, message: `${error.path}: ${error.message}` }]);
    }
    if (error instanceof EngineInputError) {
      throw new ComputeInputError(error.message, [{ path: error.field, message: error.message }]);
    }
    if (error instanceof RangeError) {
      const field = /^([A-Za-z][\w.]*)/.exec(error.message)?.[1] ?? '';
      throw new ComputeInputError(error.message, [{ path: field, message: error.message }]);
    }
    throw error;
  }
}

const assess: ComputeCommand<AssessRequest, AssessResponse> = {
  name: 'assess',
  summary: 'Peak acceleration with and without dampers under a pedestrian load case, comfort verdict, strokes and hardware numbers',
  request: assessRequestSchema,
  response: assessResponseSchema,
  run: (request) => guarded(() => assessDesign(request)),
};

const size: ComputeCommand<SizeRequest, SizeResponse> = {
  name: 'size',
  summary: 'Smallest mass ratio of a tuned damper meeting a peak-acceleration limit over a structure-frequency tolerance',
  request: sizeRequestSchema,
  response: sizeResponseSchema,
  run: (request) => guarded(() => sizeDamper(request)),
};

const robustness: ComputeCommand<RobustnessRequest, RobustnessResponse> = {
  name: 'robustness',
  summary: 'Map of peak acceleration over structure-frequency factors × damper-damping factors',
  request: robustnessRequestSchema,
  response: robustnessResponseSchema,
  run: (request) => guarded(() => mapRobustness(request)),
};

/** assess, size, robustness. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the registry holds commands of every request type
export const designCommands: Record<string, ComputeCommand<any, any>> = { assess, size, robustness };
