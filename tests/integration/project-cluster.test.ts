/**
 * The project's own cluster as `npm start` and `npm run dev` use it: created the first time, data kept between
 * starts, a running cluster reused and left running, stopped cleanly by the process that started it.
 * Run in a temporary folder standing in for the repository.
 */
import { mkdtempSync, rmSync, existsSync, chmodSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { findFreePort, projectClusterPaths, startProjectCluster, type RunningCluster } from '../../server/db/cluster';

const root = mkdtempSync(join(tmpdir(), 'stillspan-repo-'));
chmodSync(root, 0o755);
const started: RunningCluster[] = [];

afterAll(async () => {
  for (const cluster of started) await cluster.stop().catch(() => undefined);
  rmSync(root, { recursive: true, force: true });
  rmSync(projectClusterPaths(root).socketDir, { recursive: true, force: true });
});

async function query(url: string, sql: string): Promise<unknown[]> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query(sql)).rows;
  } finally {
    await client.end();
  }
}

describe('project cluster', () => {
  it('keeps its data between starts and listens on 127.0.0.1 only', async () => {
    const port = await findFreePort();
    const first = await startProjectCluster(port, root);
    started.push(first);
    expect(first).toMatchObject({ port, startedHere: true, dataDir: join(root, '.data', 'pg') });
    expect(first.url).toBe(`postgres://postgres@127.0.0.1:${port}/stillspan`);
    expect(await query(first.url, "SELECT current_setting('listen_addresses') AS listen")).toEqual([{ listen: '127.0.0.1' }]);
    await query(first.url, "CREATE TABLE kept (note text); INSERT INTO kept VALUES ('still here')");

    // A second start while it runs reuses it and will not stop it.
    const second = await startProjectCluster(port, root);
    expect(second.startedHere).toBe(false);
    await second.stop();
    expect(await query(first.url, 'SELECT note FROM kept')).toEqual([{ note: 'still here' }]);

    await first.stop();
    expect(existsSync(join(first.dataDir, 'postmaster.pid'))).toBe(false);

    const third = await startProjectCluster(port, root);
    started.push(third);
    expect(third.startedHere).toBe(true);
    expect(await query(third.url, 'SELECT note FROM kept')).toEqual([{ note: 'still here' }]);
    await third.stop();
  });
});
