import { serveStatic } from '@hono/node-server/serve-static';
import { Hono } from 'hono';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { adminAccess } from './api/admin-access.js';
import { ApiError } from './api/api-error.js';
import { analysisRoutes } from './api/analysis-routes.js';
import { corpusRoutes } from './api/corpora-routes.js';
import type { AppDeps } from './api/deps.js';
import { healthRoutes } from './api/health-routes.js';
import { mountRoutes, openApiDocument, type RouteDef } from './api/route-table.js';
import { routerRoutes } from './api/router-routes.js';

const CLIENT_DIR = fileURLToPath(new URL('../client', import.meta.url));

/** Content-Security-Policy of the UI: no inline scripts, nothing from elsewhere. */
const CSP = [
  "default-src 'self'",
  "script-src 'self'",
  // Scripts are strictly same-origin; styles also allow inline style attributes, which the map's
  // tooltip and bars use (a style cannot run code).
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "frame-ancestors 'none'",
  "form-action 'self'",
].join('; ');

/** Every route of the API, in the order they appear in the OpenAPI document. */
export function allRoutes(deps: AppDeps): RouteDef[] {
  return [...healthRoutes(deps), ...corpusRoutes(deps), ...analysisRoutes(deps), ...routerRoutes(deps)];
}

/** Builds the HTTP application: API under /api/v1, the web UI at /. */
export function createApp(deps: AppDeps): Hono {
  const app = new Hono();
  app.use('*', async (c, next) => {
    await next();
    c.header('X-Content-Type-Options', 'nosniff');
    c.header('Referrer-Policy', 'no-referrer');
    if (!c.req.path.startsWith('/api/')) c.header('Content-Security-Policy', CSP);
  });
  adminAccess(app, deps.config.adminToken);
  const routes = allRoutes(deps);
  mountRoutes(app, routes);
  const doc = openApiDocument(routes, deps.version);
  app.get('/api/v1/openapi.json', (c) => c.json(doc));
  app.all('/api/*', (c) => {
    throw new ApiError('not_found', `There is no ${c.req.method} ${c.req.path}. The API is described at /api/v1/openapi.json.`);
  });
  if (existsSync(CLIENT_DIR)) {
    app.use('/*', serveStatic({ root: CLIENT_DIR }));
    // Client-side routes: any other GET that accepts HTML gets the app shell.
    app.get('*', serveStatic({ root: CLIENT_DIR, path: 'index.html' }));
  }
  app.notFound((c) => c.json(new ApiError('not_found', `Nothing at ${c.req.path}.`).toJSON(), 404));
  app.onError((err, c) => {
    if (err instanceof ApiError) {
      for (const [k, v] of Object.entries(err.headers)) c.header(k, v);
      return c.json(err.toJSON(), err.status);
    }
    // Engine validation speaks in RangeErrors with messages written for the user.
    if (err instanceof RangeError) return c.json(new ApiError('unprocessable', err.message).toJSON(), 422);
    console.error(`[sheaf] ${c.req.method} ${c.req.path} failed:`, err);
    return c.json(new ApiError('internal', 'Something went wrong on the server. The server log has the details.').toJSON(), 500);
  });
  return app;
}
