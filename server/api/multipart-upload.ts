import busboy from 'busboy';
import { createWriteStream } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Context } from 'hono';
import { ApiError } from './api-error.js';
import { bodyChunks, tooLarge } from './read-body.js';

/** A multipart upload with its file spooled to a temporary file. */
export interface SpooledUpload {
  fields: Record<string, string>;
  file: { path: string; name: string; mimeType: string; bytes: number } | null;
  /** Removes the temporary file. */
  cleanup(): Promise<void>;
}

/**
 * Reads a multipart/form-data body: text fields into memory (small), the `file` part to a
 * temporary file. Spooling means the form fields can come in any order around the file, and the
 * file is parsed as a stream afterwards with every option known.
 */
export async function spoolMultipart(c: Context, limit: number): Promise<SpooledUpload> {
  const dir = await mkdtemp(join(tmpdir(), 'sheaf-upload-'));
  const cleanup = () => rm(dir, { recursive: true, force: true });
  const fields: Record<string, string> = {};
  let file: SpooledUpload['file'] = null;
  let bb: busboy.Busboy;
  try {
    bb = busboy({
      headers: { 'content-type': c.req.header('content-type') ?? '' },
      limits: { fields: 50, fieldSize: 64 * 1024, files: 1, fileSize: limit, parts: 60 },
    });
  } catch (e) {
    await cleanup();
    throw new ApiError('bad_request', `The multipart body cannot be read: ${(e as Error).message}.`);
  }
  const writes: Promise<void>[] = [];
  let truncated = false;
  bb.on('field', (name, value) => {
    fields[name] = value;
  });
  bb.on('file', (name, stream, info) => {
    if (name !== 'file' || file) {
      stream.resume();
      return;
    }
    const path = join(dir, 'upload');
    const entry = { path, name: info.filename ?? '', mimeType: info.mimeType ?? '', bytes: 0 };
    file = entry;
    stream.on('data', (d: Buffer) => (entry.bytes += d.length));
    stream.on('limit', () => (truncated = true));
    writes.push(pipeline(stream, createWriteStream(path)));
  });
  const done = new Promise<void>((resolve, reject) => {
    bb.on('close', resolve);
    bb.on('error', (e) => reject(e instanceof ApiError ? e : new ApiError('bad_request', `The multipart body is malformed: ${(e as Error).message}.`)));
  });
  // The pipeline below may fail first; this rejection is then already handled there.
  done.catch(() => {});
  try {
    await pipeline(Readable.from(bodyChunks(c, limit + 64 * 1024)), bb);
    await done;
    await Promise.all(writes);
  } catch (e) {
    await cleanup();
    throw e instanceof ApiError ? e : new ApiError('bad_request', `The multipart body is malformed: ${(e as Error).message}.`);
  }
  if (truncated) {
    await cleanup();
    throw tooLarge(limit);
  }
  return { fields, file, cleanup };
}
