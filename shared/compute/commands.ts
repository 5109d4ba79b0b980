import type { ComputeCommand } from './types';
import { engineCommands } from './engine-commands';
import { designCommands } from './design-commands';
import { identifyCommand } from './identify-command';

/** Every compute command, by name: used by the `calc` command and by POST /api/compute/:command. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- a registry of commands with different request types
export const computeCommands: Record<string, ComputeCommand<any, any>> = {
  ...engineCommands,
  ...designCommands,
  identify: identifyCommand,
};

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- see computeCommands
export function getComputeCommand(name: string): ComputeCommand<any, any> | undefined {
  return Object.prototype.hasOwnProperty.call(computeCommands, name) ? computeCommands[name] : undefined;
}
