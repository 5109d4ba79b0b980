import type { ComputeCommand } from './types';

/** assess, size, robustness: filled in with the load and criteria modules. */
export const designCommands: Record<string, ComputeCommand<any, any>> = {};
