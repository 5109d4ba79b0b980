/** Runs the server on PORT against DATABASE_URL; SIGINT/SIGTERM close the server and the database pool. */
import { EnvError, getEnv } from './env';
import { startServer } from './server';

async function main(): Promise<void> {
  const env = getEnv();
  const server = await startServer(env);
  const shutdown = (signal: string) => {
    process.stdout.write(`[stillspan] ${signal}: shutting down\n`);
    server.close().then(
      () => process.exit(0),
      (error: unknown) => {
        process.stderr.write(`[stillspan] error while shutting down: ${String(error)}\n`);
        process.exit(1);
      },
    );
  };
  process.once('SIGINT', () => shutdown('SIGINT'));
  process.once('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((error: unknown) => {
  process.stderr.write(error instanceof EnvError ? `${error.message}\n` : `[stillspan] could not start: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
});
