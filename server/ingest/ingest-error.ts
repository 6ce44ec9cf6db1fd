/** Machine codes of ingest failures; they match the error codes of the HTTP contract. */
export type IngestErrorCode = 'unsupported_media_type' | 'unprocessable' | 'bad_request';

/**
 * The one error the ingest step throws for bad input. The HTTP layer maps `code` to its status
 * (415, 422, 400) and sends `message` and `details` unchanged, so the message is written for the
 * person who uploaded the file.
 */
export class IngestError extends Error {
  override name = 'IngestError';

  /**
   * @param code - which contract error this is
   * @param message - a sentence a person can act on
   * @param details - machine-readable specifics (line, byte offset, field names, …)
   */
  constructor(
    readonly code: IngestErrorCode,
    message: string,
    readonly details: Record<string, unknown> = {},
  ) {
    super(message);
  }
}
