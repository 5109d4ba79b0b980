import { ExpressAuth } from '@auth/express';
import express, { type Express, type RequestHandler } from 'express';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { signInThrottle, type SignInThrottleOptions } from './auth/sign-in-throttle';
import type { AppContext } from './context';
import { defaultClientDir } from './env';
import { requireUser } from './middleware/auth';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { jsonBody, requireJsonBody, sameOrigin } from './middleware/same-origin';
import { computeRouter } from './modules/compute/compute.router';
import { configRouter } from './modules/config/config.router';
import { devMailRouter, loopbackOnly, requireDemoAdmin } from './modules/dev-mail/dev-mail.router';
import { healthRouter } from './modules/health/health.router';
import { meRouter } from './modules/me/me.router';
import { invitationsRouter, organisationRouter } from './modules/members/members.router';
import { projectMembersRouter } from './modules/project-members/project-members.router';
import { projectsRouter } from './modules/projects/projects.router';
import { comfortCriteriaRouter } from './modules/comfort-criteria/comfort-criteria.router';
import { loadCasesRouter } from './modules/load-cases/load-cases.router';
import { lumpedModelsRouter } from './modules/lumped-models/lumped-models.router';
import { modesRouter } from './modules/modes/modes.router';
import { siteRecordsRouter } from './modules/site-records/site-records.router';
import { structuresRouter } from './modules/structures/structures.router';
import { variantsRouter } from './modules/variants/variants.router';
import { signOffsRouter } from './modules/sign-offs/sign-offs.router';
import { asBuiltRouter } from './modules/as-built/as-built.router';
import { historyRouter } from './modules/history/history.router';

/**
 * Headers for every answer: no MIME sniffing, no framing by other sites, no referrer outside the site (invitation
 * links carry their token in the path), and a content security policy that allows only this site's own scripts,
 * styles, fonts and connections (the client ships everything, nothing comes from a CDN).
 */
const securityHeaders: RequestHandler = (_req, res, next) => {
  res.set({
    'X-Content-Type-Options': 'nosniff',
    'X-Frame-Options': 'DENY',
    'Referrer-Policy': 'same-origin',
    'Content-Security-Policy':
      "default-src 'self'; script-src 'self'; style-src 'self' 'unsafe-inline'; img-src 'self' data: blob:; font-src 'self' data:; " +
      "connect-src 'self'; object-src 'none'; frame-ancestors 'none'; base-uri 'self'; form-action 'self'",
  });
  next();
};

/** The whole HTTP application, without listening: the server and the tests (supertest) both use it. */
export function createApp(ctx: AppContext, options: { clientDir?: string | null; signInThrottle?: SignInThrottleOptions } = {}): Express {
  const app = express();
  app.disable('x-powered-by');
  // The client address (sign-in throttle) and protocol come from X-Forwarded-* only when the peer is trusted:
  // by default a reverse proxy on the same machine (TRUST_PROXY, see README).
  app.set('trust proxy', ctx.env.trustProxy);
  // API answers are never cached (no-store), so an ETag would only cost a hash of every body on the event loop.
  app.set('etag', false);

  app.use(securityHeaders);
  app.use('/api', (_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  app.use('/api', sameOrigin(ctx.env.appUrl));
  app.use('/api/auth/callback/credentials', ...signInThrottle(ctx.pool, options.signInThrottle));
  app.use('/api/auth', ExpressAuth(ctx.authConfig));

  app.use('/api', requireJsonBody);
  // Body limits per route: compute requests carry matrices; everything else is small.
  app.use('/api/compute', jsonBody('5mb'));
  app.use(['/api/projects', '/api/organisation', '/api/me', '/api/invitations'], jsonBody('64kb'));
  app.use('/api', jsonBody('1mb'));
  app.use('/api/health', healthRouter(ctx.pool));
  app.use('/api/config', configRouter(ctx));
  app.use('/api/invitations', invitationsRouter(ctx));
  if (!ctx.env.isProduction && ctx.fakeSmtp) {
    app.use('/api/dev/mail', loopbackOnly, requireUser(ctx.db, ctx.authConfig), requireDemoAdmin, devMailRouter(ctx.fakeSmtp));
  }

  // Mounted once for every signed-in route, so that a request falling through from one router to the next (and on
  // to the API 404) reads the session and the person once.
  // Compute uses no stored data: during a database outage the verified session token stands in for the read.
  app.use('/api/compute', requireUser(ctx.db, ctx.authConfig, { whenDatabaseDown: 'token' }));
  app.use(['/api/me', '/api/projects', '/api/organisation'], requireUser(ctx.db, ctx.authConfig));
  app.use('/api/me', meRouter(ctx.db, ctx.authConfig));
  app.use('/api/projects/:id/members', projectMembersRouter(ctx));
  app.use('/api/projects/:projectId/structures/:structureId/modes', modesRouter(ctx));
  app.use('/api/projects/:projectId/structures/:structureId/models', lumpedModelsRouter(ctx));
  app.use('/api/projects/:projectId/structures', structuresRouter(ctx));
  app.use('/api/projects/:projectId/load-cases', loadCasesRouter(ctx));
  app.use('/api/projects/:projectId/comfort-criteria', comfortCriteriaRouter(ctx));
  app.use('/api/projects/:projectId/variants', variantsRouter(ctx));
  app.use('/api/projects/:projectId/site-records', siteRecordsRouter(ctx));
  app.use('/api/projects/:projectId/sign-offs/:signOffId/as-built', asBuiltRouter(ctx));
  app.use('/api/projects/:projectId/history', historyRouter(ctx));
  app.use('/api/projects/:projectId/sign-offs', signOffsRouter(ctx));
  app.use('/api/projects', projectsRouter(ctx));
  app.use('/api/organisation', organisationRouter(ctx));
  app.use('/api/compute', computeRouter(ctx.enginePool));
  app.use('/api', apiNotFound);

  // The built client (vite build → dist/client), with every other GET answered by index.html for the client router.
  // Looked up per request, so that a build made after the server started (or during a rebuild) is picked up.
  const clientDir = options.clientDir === undefined ? defaultClientDir : options.clientDir;
  if (clientDir) app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
  app.get(/^(?!\/api(\/|$)).*/, (_req, res) => {
    const indexFile = clientDir ? join(clientDir, 'index.html') : null;
    if (indexFile && existsSync(indexFile)) {
      res.set('Cache-Control', 'no-cache').sendFile(indexFile);
      return;
    }
    res.status(404).type('text/plain').send('The client is not built: run `npm run build` (npm start does it), or use `npm run dev`.\n');
  });

  app.use(errorHandler);
  return app;
}
