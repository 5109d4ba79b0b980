/**
 * `npm run organisation:create -- --name "<organisation>" --admin-email <e-mail> [--admin-name "<name>"]`
 *
 * Creates an organisation and invites its first admin: the invitation is mailed and its link printed, so that it
 * can be handed over when no mail relay is configured. This is how a production database gets its first people
 * (no demo is seeded there). Uses DATABASE_URL, or else the project's own PostgreSQL, started for the run.
 * Exit 0 on success, 2 for bad arguments, 1 when it fails.
 */
import { parseArgs } from 'node:util';
import { z } from 'zod';
import { startProjectCluster, type RunningCluster } from '../db/cluster';
import { databaseUrlGiven, EnvError, getEnv } from '../env';
import { HttpError } from '../lib/http-error';
import { createOrganisationWithAdmin, invitationLifetimeMs } from '../modules/members/members.service';
import { closeContext, createContext } from '../server';
import { toApiIssues } from '../../shared/contracts/errors';

const argsSchema = z.object({
  name: z.string({ error: 'is required' }).trim().min(1, 'is required').max(200),
  'admin-email': z.string({ error: 'is required' }).trim().toLowerCase().pipe(z.email('must be an e-mail address')),
  'admin-name': z.string().trim().min(1).max(120).optional(),
});

async function main(): Promise<number> {
  let values: Record<string, unknown>;
  try {
    values = parseArgs({
      options: { name: { type: 'string' }, 'admin-email': { type: 'string' }, 'admin-name': { type: 'string' } },
      strict: true,
    }).values;
  } catch (error) {
    process.stderr.write(`${(error as Error).message}\nUsage: npm run organisation:create -- --name "<organisation>" --admin-email <e-mail> [--admin-name "<name>"]\n`);
    return 2;
  }
  const args = argsSchema.safeParse(values);
  if (!args.success) {
    for (const issue of toApiIssues(args.error)) process.stderr.write(`--${issue.message}\n`);
    return 2;
  }
  const env = getEnv();
  let cluster: RunningCluster | null = null;
  if (!databaseUrlGiven()) cluster = await startProjectCluster(env.pgPort);
  // No demo seed here: the organisation is a real one.
  const ctx = await createContext({ ...env, databaseUrl: cluster?.url ?? env.databaseUrl, fakeSmtp: false }, { seed: false });
  try {
    const result = await createOrganisationWithAdmin(ctx, {
      organisationName: args.data.name,
      adminEmail: args.data['admin-email'],
      adminName: args.data['admin-name'],
    });
    process.stdout.write(`Created the organisation "${args.data.name}" (${result.organisationId}).\n`);
    process.stdout.write(
      result.mailError
        ? `The invitation mail could not be sent (${result.mailError}); hand this link to ${args.data['admin-email']}:\n`
        : `Invitation mailed to ${args.data['admin-email']}; the link, valid for ${invitationLifetimeMs / 86_400_000} days:\n`,
    );
    process.stdout.write(`  ${result.link}\n`);
    return 0;
  } catch (error) {
    if (error instanceof HttpError && error.status < 500) {
      process.stderr.write(`${error.message}\n`);
      return 2;
    }
    throw error;
  } finally {
    await closeContext(ctx);
    await cluster?.stop();
  }
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    process.stderr.write(error instanceof EnvError ? `${error.message}\n` : `Could not create the organisation: ${error instanceof Error ? error.message : String(error)}\n`);
    process.exit(1);
  },
);
