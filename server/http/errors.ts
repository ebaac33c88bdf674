// One error type for the API and one handler that turns it (or anything unexpected) into the ApiErrorBody shape.
import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '../../shared/api';

type Code = ApiErrorBody['error']['code'];

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: Code,
    message: string,
    readonly issues?: { path: string; message: string }[],
  ) {
    super(message);
  }
}

export const badRequest = (message: string, issues?: { path: string; message: string }[]) =>
  new HttpError(400, 'bad_request', message, issues);
export const unauthorized = () => new HttpError(401, 'unauthorized', 'Sign in to continue');
export const forbidden = (message: string) => new HttpError(403, 'forbidden', message);
export const notFound = (what: string) => new HttpError(404, 'not_found', `${what} not found`);
export const conflict = (message: string) => new HttpError(409, 'conflict', message);

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'not_found', `No API route ${req.method} ${req.path}`));
};

export function errorHandler(log: (line: string) => void): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (err instanceof HttpError) {
      const body: ApiErrorBody = { error: { code: err.code, message: err.message, ...(err.issues ? { issues: err.issues } : {}) } };
      res.status(err.status).json(body);
      return;
    }
    // express.json() reports malformed bodies with a status of 400 and type 'entity.parse.failed'.
    if (err && typeof err === 'object' && 'type' in err && err.type === 'entity.parse.failed') {
      res.status(400).json({ error: { code: 'bad_request', message: 'The request body is not valid JSON' } } satisfies ApiErrorBody);
      return;
    }
    if (err && typeof err === 'object' && 'type' in err && err.type === 'entity.too.large') {
      res.status(413).json({ error: { code: 'bad_request', message: 'The request body is too large' } } satisfies ApiErrorBody);
      return;
    }
    log(`error ${req.method} ${req.originalUrl}: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server' } } satisfies ApiErrorBody);
  };
}
