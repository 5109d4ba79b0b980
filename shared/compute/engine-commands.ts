import type { ComputeCommand } from './types';

/** modes, tune, response, free: filled in with the engine. */
export const engineCommands: Record<string, ComputeCommand<any, any>> = {};
