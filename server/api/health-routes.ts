import type { AppDeps } from './deps.js';
import type { RouteDef } from './route-table.js';

/** `GET /health`: answers as soon as the server accepts work, without touching the workers. */
export function healthRoutes(deps: AppDeps): RouteDef[] {
  return [
    {
      method: 'get',
      path: '/health',
      tag: 'service',
      summary: 'Liveness: the server accepts work',
      responses: {
        200: {
          description: 'Up.',
          schema: {
            type: 'object',
            properties: { status: { type: 'string', enum: ['ok'] }, version: { type: 'string' }, jobs: { type: 'object', properties: {} } },
          },
        },
      },
      handler: (c) => c.json({ status: 'ok', version: deps.version, jobs: { running: deps.runner.active, workers: deps.pool.size } }),
    },
  ];
}
