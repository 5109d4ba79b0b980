import { startProjectCluster, type RunningCluster } from '../db/cluster';
import { databaseUrlGiven } from '../env';

/**
 * For `npm start` and `npm run dev`: when DATABASE_URL is not set, starts (or reuses) the project's own cluster,
 * which first makes sure Debian's PostgreSQL is installed; when it is set, starts nothing and returns null.
 */
export async function startProjectDatabaseUnlessGiven(pgPort: number): Promise<RunningCluster | null> {
  if (databaseUrlGiven()) return null;
  return startProjectCluster(pgPort);
}

/** Stops the command on SIGINT or SIGTERM (Ctrl-C, or a service manager) through its own clean-up. */
export function stopOnSignals(stopAll: (code: number) => Promise<never>): void {
  process.once('SIGINT', () => void stopAll(0));
  process.once('SIGTERM', () => void stopAll(0));
}
