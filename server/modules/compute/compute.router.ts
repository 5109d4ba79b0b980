import { Router } from 'express';
import { z } from 'zod';
import type { EnginePool } from '../../workers/engine-pool';
import { validate, parsed } from '../../middleware/validate';
import { listComputeCommands, runComputeCommand } from './compute.service';

const commandParamsSchema = z.object({ command: z.string().min(1).max(100) });

/** /api/compute: the engine's commands, for any signed-in person (requireUser runs before), run in the worker pool. */
export function computeRouter(pool: EnginePool): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.json({ commands: listComputeCommands() });
  });
  router.post('/:command', validate({ params: commandParamsSchema }), async (req, res) => {
    const json = await runComputeCommand(pool, parsed(commandParamsSchema, req.params).command, req.body);
    res.type('application/json').send(json);
  });
  return router;
}
