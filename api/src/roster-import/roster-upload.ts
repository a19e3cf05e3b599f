import { BadRequestException, CallHandler, ExecutionContext, Injectable, NestInterceptor, PayloadTooLargeException } from '@nestjs/common';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import express from 'express';
import { catchError, Observable, throwError } from 'rxjs';
import { MAX_ROSTER_BYTES, TOO_LARGE_MESSAGE } from './roster-file';

/** The roster import's routes (preview, import, invitations): their bodies may be larger than others. */
export const ROSTER_IMPORT_ROUTES = '/api/guilds/:guildId/roster-import';

/** A JSON body holding 5 MB of text can grow when tabs, line breaks and quotes are escaped. */
export const ROSTER_JSON_LIMIT = 2 * MAX_ROSTER_BYTES + 64 * 1024;
/** A multipart upload: the file plus its few small fields. */
export const ROSTER_UPLOAD_LIMIT = MAX_ROSTER_BYTES + 256 * 1024;

function tooLarge(req: Request): PayloadTooLargeException {
  // Let the rest of the body run off without keeping it; the answer goes at once.
  req.resume();
  return new PayloadTooLargeException(TOO_LARGE_MESSAGE);
}

/**
 * JSON bodies for the roster import's routes, up to ROSTER_JSON_LIMIT, read before the app's own
 * JSON parser (which keeps its smaller limit for every other route and then skips these bodies).
 * Anything larger is refused from its Content-Length alone, before any of it is read.
 */
export function rosterImportJsonParser(): RequestHandler {
  const json = express.json({ limit: ROSTER_JSON_LIMIT });
  return (req: Request, res: Response, next: NextFunction) => {
    if (!req.is('application/json')) return next();
    if (Number(req.headers['content-length'] ?? 0) > ROSTER_JSON_LIMIT) return next(tooLarge(req));
    json(req, res, (err?: unknown) => {
      if (err && (err as { type?: string }).type === 'entity.too.large') return next(tooLarge(req));
      next(err as Error | undefined);
    });
  };
}

/**
 * Put in front of the multipart file interceptor: refuses an upload whose Content-Length is over
 * the limit before reading any of it, and gives multer's own "too large" our wording.
 */
@Injectable()
export class RosterUploadGate implements NestInterceptor {
  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    const req = context.switchToHttp().getRequest<Request>();
    if (req.is('multipart/form-data') && Number(req.headers['content-length'] ?? 0) > ROSTER_UPLOAD_LIMIT) throw tooLarge(req);
    return next.handle().pipe(
      catchError((e: unknown) => {
        if (e instanceof PayloadTooLargeException) return throwError(() => new PayloadTooLargeException(TOO_LARGE_MESSAGE));
        // multer's wording for a file sent under another name, or more than one file.
        if (e instanceof BadRequestException && /Unexpected (file )?field|Too many files/i.test(e.message))
          return throwError(() => new BadRequestException('Send one file, in the form field named “file”.'));
        return throwError(() => e);
      }),
    );
  }
}

export const ROSTER_MULTER_OPTIONS = {
  limits: { fileSize: MAX_ROSTER_BYTES, files: 1, fields: 6, fieldSize: MAX_ROSTER_BYTES + 1024 },
};
