import type { ContentfulStatusCode } from 'hono/utils/http-status';

/** The error codes of the contract, with their HTTP status. */
export const ERROR_STATUS = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  too_many_requests: 429,
  internal: 500,
  unavailable: 503,
} as const satisfies Record<string, ContentfulStatusCode>;

export type ErrorCode = keyof typeof ERROR_STATUS;

/**
 * An error answered as `{"error":{"code","message","details"}}`. Thrown anywhere in a handler;
 * the app's error handler turns it into the response.
 */
export class ApiError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details: Record<string, unknown> = {},
    readonly headers: Record<string, string> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }

  get status(): ContentfulStatusCode {
    return ERROR_STATUS[this.code];
  }

  toJSON() {
    return { error: { code: this.code, message: this.message, details: this.details } };
  }
}

/** 404 for a thing of the given kind and id. */
export function notFound(kind: string, id: string): ApiError {
  return new ApiError('not_found', `No ${kind} with id "${id}".`, { kind, id });
}
