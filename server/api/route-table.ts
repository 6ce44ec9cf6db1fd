import type { Context, Hono } from 'hono';
import { ApiError } from './api-error.js';
import { bodyText } from './read-body.js';
import { validate, type Schema } from './schema.js';

/** What a validated handler receives. */
export interface RouteInput<B = unknown, Q = Record<string, string>> {
  body: B;
  query: Q;
}

/** One endpoint: how it is served and how it is described in the OpenAPI document. */
export interface RouteDef {
  method: 'get' | 'post' | 'patch' | 'delete';
  /** Hono-style path below /api/v1, e.g. `/corpora/:cid`. */
  path: string;
  summary: string;
  description?: string;
  tag: string;
  /** JSON body schema; the body is parsed and validated before the handler runs. */
  body?: Schema;
  /** Body described in OpenAPI but parsed by the handler itself (uploads). */
  rawBody?: Record<string, { schema: Schema }>;
  query?: Extract<Schema, { type: 'object' }>;
  /** Status → description (and optional JSON schema) of the answers. */
  responses: Record<number, { description: string; schema?: Schema; contentType?: string }>;
  /** Largest JSON body accepted. @default 1 MiB */
  maxBodyBytes?: number;
  /** `router-key`: needs a router key (documented as Bearer security). */
  security?: 'router-key' | 'admin';
  handler: (c: Context, input: RouteInput<any, any>) => Response | Promise<Response>;
}

async function readJson(c: Context, limit: number): Promise<unknown> {
  const type = c.req.header('content-type') ?? '';
  if (!/^application\/json\b/i.test(type) && !/\+json\b/i.test(type)) {
    throw new ApiError('unsupported_media_type', `Send the body as JSON with Content-Type: application/json (got "${type || 'none'}").`);
  }
  const text = await bodyText(c, limit);
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new ApiError('bad_request', `The body is not valid JSON: ${(e as Error).message}`);
  }
}

function coerceQuery(schema: Extract<Schema, { type: 'object' }>, raw: Record<string, string>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(raw)) {
    const s = schema.properties[k];
    if (s && 'type' in s && (s.type === 'integer' || s.type === 'number') && v.trim() !== '' && !Number.isNaN(Number(v))) out[k] = Number(v);
    else out[k] = v;
  }
  return out;
}

const DEFAULT_MAX_BODY = 1024 * 1024;

/** Every id we issue fits this; anything else in a path cannot name a thing of ours. */
const PATH_ID = /^[A-Za-z0-9_-]{1,64}$/;

/** Registers the routes on `app` under `/api/v1`, validating bodies and queries first. */
export function mountRoutes(app: Hono, routes: readonly RouteDef[]): void {
  for (const r of routes) {
    app[r.method]('/api/v1' + r.path, async (c) => {
      for (const [name, value] of Object.entries(c.req.param() as Record<string, string>)) {
        if (!PATH_ID.test(value)) throw new ApiError('not_found', `No such ${name === 'clid' ? 'theme' : 'item'}: "${value.slice(0, 64)}" is not an id sheaf issues.`, { [name]: value.slice(0, 64) });
      }
      let body: unknown = undefined;
      if (r.body) {
        body = await readJson(c, r.maxBodyBytes ?? DEFAULT_MAX_BODY);
        const issues = validate(r.body, body);
        if (issues.length) throw new ApiError('bad_request', `The request body is not valid: ${issues[0].path} ${issues[0].message}.`, { issues });
      }
      let query: Record<string, unknown> = c.req.query();
      if (r.query) {
        query = coerceQuery(r.query, query as Record<string, string>);
        const issues = validate(r.query, query);
        if (issues.length) throw new ApiError('bad_request', `The query is not valid: ${issues[0].path} ${issues[0].message}.`, { issues });
      }
      return r.handler(c, { body, query });
    });
  }
}

const ERROR_SCHEMA: Schema = {
  type: 'object',
  properties: {
    error: {
      type: 'object',
      properties: { code: { type: 'string' }, message: { type: 'string' }, details: { type: 'object', properties: {} } },
      required: ['code', 'message'],
    },
  },
  required: ['error'],
};

/** The OpenAPI 3.1 document of the routes, built from the same schemas that validate requests. */
export function openApiDocument(routes: readonly RouteDef[], version: string): Record<string, unknown> {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const r of routes) {
    const path = r.path.replace(/:([A-Za-z]+)/g, '{$1}');
    const params = [...r.path.matchAll(/:([A-Za-z]+)/g)].map((m) => ({ name: m[1], in: 'path', required: true, schema: { type: 'string' } }));
    for (const [name, schema] of Object.entries(r.query?.properties ?? {})) {
      params.push({ name, in: 'query', required: false, schema: schema as { type: 'string' } });
    }
    const responses: Record<string, unknown> = {};
    for (const [status, res] of Object.entries(r.responses)) {
      responses[status] = res.schema
        ? { description: res.description, content: { [res.contentType ?? 'application/json']: { schema: res.schema } } }
        : { description: res.description };
    }
    responses.default = { description: 'An error, in the contract\u2019s error shape.', content: { 'application/json': { schema: ERROR_SCHEMA } } };
    const op: Record<string, unknown> = {
      operationId: `${r.method}${r.path.replace(/[/:](\w)/g, (_, ch: string) => ch.toUpperCase()).replace(/[^A-Za-z]/g, '')}`,
      summary: r.summary,
      tags: [r.tag],
      parameters: params,
      responses,
    };
    if (r.description) op.description = r.description;
    if (r.body) op.requestBody = { required: true, content: { 'application/json': { schema: r.body } } };
    if (r.rawBody) op.requestBody = { required: true, content: r.rawBody };
    if (r.security === 'router-key') op.security = [{ routerKey: [] }];
    (paths['/api/v1' + path] ??= {})[r.method] = op;
  }
  return {
    openapi: '3.1.0',
    info: { title: 'sheaf API', version, description: 'Themes from unlabelled text, and routing of new text into them.' },
    paths,
    components: {
      securitySchemes: { routerKey: { type: 'http', scheme: 'bearer', description: 'A router key from POST /routers/{rid}/keys.' } },
      schemas: { Error: ERROR_SCHEMA },
    },
  };
}
