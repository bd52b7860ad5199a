/** @jsxImportSource hono/jsx */
import { storageFailure } from '../store/storage-failure.ts';
import { Hono } from 'hono';
import { bodyLimit } from 'hono/body-limit';
import { HttpError } from '../errors.ts';
import type { Store } from '../store/connect.ts';
import { ErrorFragment, ErrorPage } from '../../views/error-page.tsx';
import type { AppEnv } from './context.ts';
import { csrfProtection } from './middleware/csrf.ts';
import { securityHeaders } from './middleware/security-headers.ts';
import { sessionLoader } from './middleware/session.ts';
import { adminRoutes } from './routes/admin.tsx';
import { adjudicationRoutes } from './routes/adjudication.tsx';
import { apiRoutes } from './routes/api.ts';
import type { RateLimit } from './middleware/api-token.ts';
import { authRoutes } from './routes/auth.tsx';
import { batchRoutes } from './routes/batches.tsx';
import { batchIoRoutes } from './routes/batch-io.tsx';
import { ImportJobs } from '../io/import-jobs.ts';
import { queueRoutes } from './routes/queue.tsx';
import { reviewRoutes } from './routes/review.tsx';
import { rubricRoutes } from './routes/rubrics.tsx';
import { statsRoutes } from './routes/stats.tsx';
import { staticRoutes } from './routes/static-files.ts';

export interface AppOptions {
  store: Store;
  secureCookies?: boolean;
  /** Largest request body accepted, in bytes. */
  maxBodyBytes?: number;
  /** Requests an API token may make per window. */
  apiRateLimit?: RateLimit;
}

/**
 * Builds the web app over an open store. Tests call `createApp(...).request(url)` in-process.
 *
 * @example
 * const app = createApp({ store });
 * const res = await app.request('/healthz');
 */
export function createApp(options: AppOptions) {
  const app = new Hono<AppEnv>();
  app.use(securityHeaders());
  app.use(async (c, next) => {
    c.set('store', options.store);
    c.set('secureCookies', options.secureCookies ?? false);
    await next();
  });
  app.get('/healthz', (c) => c.json({ ok: true }));
  app.route('/', staticRoutes());
  const limitBody = bodyLimit({ maxSize: options.maxBodyBytes ?? 50 * 1024 * 1024, onError: () => { throw new HttpError(413, 'The upload is larger than this server accepts. Split the file into smaller batches.'); } });
  // GET and HEAD carry no body; asking for one makes the Node adapter build a whole Request per page view
  app.use((c, next) => (c.req.method === 'GET' || c.req.method === 'HEAD' ? next() : limitBody(c, next)));
  app.use(sessionLoader());
  app.use(csrfProtection({ exempt: (path) => path.startsWith('/api/') }));
  app.route('/', authRoutes());
  app.route('/', queueRoutes());
  app.route('/', batchRoutes());
  app.route('/', batchIoRoutes(new ImportJobs()));
  app.route('/', reviewRoutes());
  app.route('/', adjudicationRoutes());
  app.route('/', rubricRoutes());
  app.route('/', statsRoutes());
  app.route('/', adminRoutes());
  app.route('/', apiRoutes({ rateLimit: options.apiRateLimit }));

  app.notFound((c) => renderError(c, new HttpError(404, 'There is no page at this address. Go back to the queue.')));
  app.onError((error, c) => renderError(c, error));
  return app;
}

function renderError(c: Parameters<Parameters<Hono<AppEnv>['onError']>[0]>[1], error: Error) {
  const failure = error instanceof HttpError ? null : storageFailure(error);
  if (failure) console.error(`storage failure on ${c.req.method} ${c.req.path}: ${error.message}`);
  const http = error instanceof HttpError ? error : failure ? new HttpError(503, failure.message) : null;
  const status = http?.status ?? 500;
  const message = http?.message ?? 'The server hit an unexpected error. Try again; if it keeps happening, tell your admin the time it happened.';
  if (!http && process.env.DEBUG) console.error(error);
  if (c.req.header('hx-request')) return c.html(<ErrorFragment status={status} message={message} />, status);
  if (c.req.path.startsWith('/api/')) return c.json({ error: message }, status);
  return c.html(<ErrorPage status={status} message={message} user={c.get('user') ?? null} csrfToken={c.get('csrfToken') ?? ''} />, status);
}
