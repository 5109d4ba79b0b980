import { Router } from 'express';
import { z } from 'zod';
import { validate, parsed } from '../../middleware/validate';
import { listComputeCommands, runComputeCommand } from './compute.service';

const commandParamsSchema = z.object({ command: z.string().min(1).max(100) });

/** /api/compute: the engine's commands, for any signed-in person (requireUser runs before). */
export function computeRouter(): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.json({ commands: listComputeCommands() });
  });
  router.post('/:command', validate({ params: commandParamsSchema }), (req, res) => {
    res.json(runComputeCommand(parsed(commandParamsSchema, req.params).command, req.body));
  });
  return router;
}
