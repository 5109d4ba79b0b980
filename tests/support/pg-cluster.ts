/**
 * Throwaway PostgreSQL clusters for the integration and end-to-end suites: a fresh initdb in a temporary folder,
 * a free port on 127.0.0.1, fsync off. Each call gives an independent cluster; `stop()` removes it.
 */
export { startThrowawayCluster, ensureDatabase, clusterUrl } from '../../server/db/cluster';
