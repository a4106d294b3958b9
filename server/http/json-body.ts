import express, { type RequestHandler } from 'express';
import { HttpError } from './errors';
import { jsonDepthExceeds, LIMITS } from './limits';

/**
 * The JSON body parser of a route that declares a body: at most `limitBytes` (413 `payload_too_large`
 * past it, before the body is read further) and at most LIMITS.JSON_MAX_DEPTH levels of nesting, checked
 * on the raw bytes before JSON.parse runs (400 `json_too_deep`). A request of another content type is
 * left alone (multipart forms are read by their route's own middleware).
 */
export function jsonBody(limitBytes: number = LIMITS.JSON_BODY_MAX_BYTES): RequestHandler {
  return express.json({
    limit: limitBytes,
    strict: true,
    verify: (_req, _res, buf) => {
      if (jsonDepthExceeds(buf, LIMITS.JSON_MAX_DEPTH))
        throw new HttpError(400, 'json_too_deep', `The JSON body is nested more than ${LIMITS.JSON_MAX_DEPTH} levels deep.`, undefined, {
          maxDepth: LIMITS.JSON_MAX_DEPTH,
        });
    },
  });
}
