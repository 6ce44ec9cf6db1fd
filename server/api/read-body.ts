import type { Context } from 'hono';
import { ApiError } from './api-error.js';

function tooLarge(limit: number): ApiError {
  const mb = Math.round(limit / (1024 * 1024));
  return new ApiError('payload_too_large', `The upload is larger than the limit of ${mb} MB (MAX_UPLOAD_MB). Split the file or raise the limit.`, {
    limitBytes: limit,
  });
}

/**
 * The request body as a stream of chunks, refusing with 413 as soon as it passes `limit` bytes
 * (before reading anything when Content-Length already says so).
 */
export async function* bodyChunks(c: Context, limit: number): AsyncGenerator<Uint8Array> {
  const declared = Number(c.req.header('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(limit);
  const body = c.req.raw.body;
  if (!body) return;
  let seen = 0;
  const reader = body.getReader();
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return;
      seen += value.byteLength;
      if (seen > limit) throw tooLarge(limit);
      yield value;
    }
  } finally {
    reader.releaseLock();
  }
}

/** The whole body as text, within `limit` bytes. */
export async function bodyText(c: Context, limit: number): Promise<string> {
  const declared = Number(c.req.header('content-length') ?? NaN);
  if (Number.isFinite(declared)) {
    if (declared > limit) throw tooLarge(limit);
    // Node's HTTP parser never delivers more than Content-Length says, and reading through Hono
    // here skips building a web stream for every small request (the hot path of routing).
    return c.req.text();
  }
  const parts: Uint8Array[] = [];
  for await (const chunk of bodyChunks(c, limit)) parts.push(chunk);
  return Buffer.concat(parts).toString('utf8');
}

export { tooLarge };
