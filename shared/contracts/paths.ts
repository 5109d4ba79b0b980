import type { ApiIssue } from './errors';
import { joinPath, prefixMessage } from '../engine/input-paths';

/**
 * Field paths of bad input (`structure.dampingRatio`, `tmds.0.massKg`): every check reports the path inside its own
 * input; whoever holds that input puts its own place in front. The string rules live with the engine's checks
 * (shared/engine/input-paths.ts); this adds the API's issue lists.
 */
export { joinPath, prefixMessage };

/** The issues of a check with `prefix` in front of every path and of the path that starts each message. */
export function prefixIssues(prefix: string, issues: readonly ApiIssue[]): ApiIssue[] {
  return issues.map((issue) => ({ path: joinPath(prefix, issue.path), message: prefixMessage(prefix, issue.path, issue.message) }));
}
