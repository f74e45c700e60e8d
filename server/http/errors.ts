import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError, type ZodType } from 'zod';
import { HttpError, badRequest, notFound } from '../lib/errors';

// Routes import the error helpers from here or from server/lib/errors (services only from there).
export { HttpError, badRequest, conflict, forbidden, notFound, notSignedIn } from '../lib/errors';

/** Zod issues → `{field: message}`, first message per field; nested paths joined with dots. */
export function zodFields(err: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_';
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

/** Validates `value` (a body, or a params object) with `schema`, or throws 400 `invalid_input` with fields. */
export function parseInput<T>(schema: ZodType<T>, value: unknown): T {
  const r = schema.safeParse(value ?? {});
  if (!r.success) {
    const fields = zodFields(r.error);
    const first = Object.values(fields)[0] ?? 'Invalid input';
    throw badRequest('invalid_input', first, fields);
  }
  return r.data;
}

/** Every unknown /api route. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(notFound('not_found', `No such API route: ${req.method} ${req.originalUrl.split('?')[0]}`));
};

interface ParserError {
  type?: string;
  status?: number;
  statusCode?: number;
  code?: string;
  expose?: boolean;
}

/** Maps anything thrown to `{status, body}`; unknown errors become a bare 500 (details stay in the log). */
export function toErrorResponse(err: unknown): { status: number; body: { error: { code: string; message: string; fields?: Record<string, string> } }; log: boolean } {
  if (err instanceof HttpError) {
    const error = { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) };
    return { status: err.status, body: { error }, log: false };
  }
  if (err instanceof ZodError) {
    const fields = zodFields(err);
    return { status: 400, body: { error: { code: 'invalid_input', message: Object.values(fields)[0] ?? 'Invalid input', fields } }, log: false };
  }
  const e = (err ?? {}) as ParserError;
  // body-parser (express.json) errors
  if (e.type === 'entity.parse.failed') return { status: 400, body: { error: { code: 'malformed_json', message: 'The request body is not valid JSON' } }, log: false };
  if (e.type === 'entity.too.large' || e.code === 'LIMIT_FILE_SIZE') return { status: 413, body: { error: { code: 'too_large', message: 'The request body is too large' } }, log: false };
  if (e.type === 'encoding.unsupported' || e.type === 'charset.unsupported') return { status: 415, body: { error: { code: 'unsupported_encoding', message: 'Unsupported content encoding' } }, log: false };
  if (err instanceof Error && err.name === 'MulterError') {
    return { status: 400, body: { error: { code: 'bad_upload', message: err.message } }, log: false };
  }
  const status = e.status ?? e.statusCode;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    const message = e.expose && err instanceof Error ? err.message : 'Bad request';
    return { status, body: { error: { code: 'bad_request', message } }, log: false };
  }
  return { status: 500, body: { error: { code: 'internal_error', message: 'Something went wrong on the server' } }, log: true };
}

/** The one error middleware. Never sends a stack trace. */
export function errorHandler(logErrors: boolean): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) return next(err);
    const { status, body, log } = toErrorResponse(err);
    if (log && logErrors) console.error(`error in ${req.method} ${req.originalUrl}:`, err);
    res.status(status).json(body);
  };
}
