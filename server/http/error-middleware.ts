import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import { HttpError } from './errors';
import { routeOf } from './request-log';
import { formatBytes } from './uploads';

/** Body-parser and multer errors carry a status or a code of their own: give them stable codes. */
function fromKnown(err: any, limitBytes?: number): HttpError | null {
  if (err instanceof HttpError) return err;
  if (err?.type === 'entity.parse.failed') return new HttpError(400, 'malformed_json', 'The body is not valid JSON.');
  if (err?.type === 'entity.too.large')
    return new HttpError(413, 'payload_too_large',
      typeof err.limit === 'number' ? `The body is larger than the limit of ${formatBytes(err.limit)}.` : 'The body is too large.');
  if (err?.type === 'encoding.unsupported' || err?.type === 'charset.unsupported')
    return new HttpError(415, 'unsupported_encoding', 'The body encoding is not supported.');
  if (err?.name === 'MulterError' && err.code === 'LIMIT_FILE_SIZE' && limitBytes) {
    const limit = formatBytes(limitBytes);
    return new HttpError(413, 'file_too_large', `The file is larger than the limit of ${limit}.`, [
      { path: err.field ?? 'file', message: `is larger than the limit of ${limit}` },
    ]);
  }
  if (err?.name === 'MulterError') {
    const status = err.code === 'LIMIT_FILE_SIZE' ? 413 : 400;
    return new HttpError(status, err.code === 'LIMIT_FILE_SIZE' ? 'file_too_large' : 'bad_upload', err.message, [
      { path: err.field ?? 'file', message: err.message },
    ]);
  }
  if (typeof err?.status === 'number' && err.status >= 400 && err.status < 500 && err.expose)
    return new HttpError(err.status, 'bad_request', err.message);
  return null;
}

/** Database unreachable: the API says so with 503 rather than a bare 500. */
function isDatabaseDown(err: any): boolean {
  const code = err?.code ?? err?.driverError?.code;
  return ['ECONNREFUSED', 'ECONNRESET', '57P01', '57P03', 'ETIMEDOUT'].includes(code) ||
    /Connection terminated|timeout exceeded when trying to connect/i.test(String(err?.message));
}

export function errorMiddleware(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let httpError = fromKnown(err, res.locals?.uploadLimitBytes);
    if (!httpError && isDatabaseDown(err)) {
      httpError = new HttpError(503, 'database_unavailable', 'The database is not answering. Try again in a minute.');
    }
    if (!httpError) {
      logger.error({ err, method: req.method, route: routeOf(req) }, 'unhandled error');
      httpError = new HttpError(500, 'internal', 'Something went wrong on the server.');
    } else if (httpError.status >= 500) {
      logger.warn({ code: httpError.code, route: routeOf(req) }, httpError.message);
    }
    if (res.headersSent) return;
    res.status(httpError.status).json({
      error: { code: httpError.code, message: httpError.message, ...(httpError.fields ? { fields: httpError.fields } : {}),
        ...(httpError.params ? { params: httpError.params } : {}) },
    });
  };
}

export const apiNotFound: RequestHandler = (req, _res, next) =>
  next(new HttpError(404, 'not_found', `No API route ${req.method} ${req.path}.`));
