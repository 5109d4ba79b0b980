/**
 * Global set-up of the integration suite: one throwaway PostgreSQL cluster for the run, with a template database
 * that has every migration applied. Each test file clones the template into a database of its own
 * (tests/support/test-app.ts), so files never see each other's rows. The teardown removes the cluster.
 */
import type {} from 'vitest';
import type { TestProject } from 'vitest/node';
import { applyMigrations, createDatabase, createPool } from '../../server/db/client';
import { clusterUrl, ensureDatabase, startThrowawayCluster } from './pg-cluster';

export const templateDatabase = 'stillspan_template';

declare module 'vitest' {
  export interface ProvidedContext {
    /** Port of the suite's throwaway cluster on 127.0.0.1 (user postgres, trust). */
    pgPort: number;
    /** A database with every migration applied, to clone with CREATE DATABASE … TEMPLATE. */
    pgTemplate: string;
  }
}

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const cluster = await startThrowawayCluster();
  try {
    await ensureDatabase(cluster.port, templateDatabase);
    const pool = createPool(clusterUrl(cluster.port, templateDatabase));
    try {
      await applyMigrations(createDatabase(pool));
    } finally {
      await pool.end();
    }
  } catch (error) {
    await cluster.stop();
    throw error;
  }
  project.provide('pgPort', cluster.port);
  project.provide('pgTemplate', templateDatabase);
  return () => cluster.stop();
}
