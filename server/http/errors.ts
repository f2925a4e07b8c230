import type { ErrorRequestHandler, RequestHandler } from 'express';

/** The one error envelope every API response uses: { error: { code, message, fields? } }. */
export interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string>; problems?: unknown[] };
}

/** An error a route means to send: status, a stable code and a sentence a person can act on. */
export class HttpError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: Record<string, string>,
    /** A list of findings (e.g. every problem of a rejected import), for the client to show in full. */
    public readonly problems?: unknown[],
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'not-found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}.`));
};

/**
 * Turns anything thrown into the envelope. Unknown errors are logged on the
 * server and reach the client only as a generic 500 — never a stack trace.
 */
export function errorHandler(log: (msg: string, err: unknown) => void): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return;
    const known = toHttpError(err);
    if (!known) log(`${req.method} ${req.originalUrl} failed`, err);
    const e = known ?? new HttpError(500, 'internal', 'Something went wrong on the server; it has been logged.');
    const body: ErrorBody = { error: { code: e.code, message: e.message } };
    if (e.fields) body.error.fields = e.fields;
    if (e.problems) body.error.problems = e.problems;
    res.status(e.status).json(body);
  };
}

/** Errors raised by body parsers and other middleware carry their own status. */
function toHttpError(err: unknown): HttpError | null {
  if (err instanceof HttpError) return err;
  const e = err as { status?: number; type?: string; message?: string };
  if (e?.type === 'entity.too.large') return new HttpError(413, 'too-large', 'The request body is larger than the server accepts.');
  if (e?.type === 'entity.parse.failed') return new HttpError(400, 'bad-json', 'The request body is not valid JSON.');
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
    return new HttpError(e.status, 'bad-request', e.message ?? 'The request was not accepted.');
  }
  return null;
}
