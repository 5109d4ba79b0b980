import type { ComputeCommand } from './types';
import { engineCommands } from './engine-commands';
import { designCommands } from './design-commands';

/** Every compute command, by name: used by the `calc` command and by POST /api/compute/:command. */
export const computeCommands: Record<string, ComputeCommand<any, any>> = {
  ...engineCommands,
  ...designCommands,
};

export function getComputeCommand(name: string): ComputeCommand<any, any> | undefined {
  return Object.prototype.hasOwnProperty.call(computeCommands, name) ? computeCommands[name] : undefined;
}
