/**
 * Throwaway PostgreSQL clusters for the integration and end-to-end suites: a fresh initdb in a temporary folder,
 * a free port on 127.0.0.1, fsync off. Each call gives an independent cluster; `stop()` removes it. Also the free-port
 * probe the suites use for the servers they start.
 */
export { startThrowawayCluster, ensureDatabase, clusterUrl, findFreePort } from '../../server/db/cluster';
