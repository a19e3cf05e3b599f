import { DriverException, NotFoundError, UniqueConstraintViolationException } from '@mikro-orm/core';
import { ArgumentsHost, Catch, ExceptionFilter, HttpException, HttpStatus, Logger } from '@nestjs/common';
import type { Request, Response } from 'express';

interface ErrorBody {
  statusCode: number;
  message: string;
  errors?: Record<string, string[]>;
}

/** Every error leaves as `{ statusCode, message, errors? }`; nothing leaks a stack or SQL. */
@Catch()
export class HttpErrorFilter implements ExceptionFilter {
  private readonly logger = new Logger('HttpError');

  catch(exception: unknown, host: ArgumentsHost): void {
    const res = host.switchToHttp().getResponse<Response>();
    const req = host.switchToHttp().getRequest<Request>();
    const body = plainWords(this.toBody(exception), req?.path ?? '');
    if (body.statusCode >= 500) this.logger.error(exception instanceof Error ? exception.stack : String(exception));
    if (res.headersSent) return;
    res.status(body.statusCode).json(body);
  }

  private toBody(exception: unknown): ErrorBody {
    if (exception instanceof HttpException) {
      const status = exception.getStatus();
      const response = exception.getResponse();
      if (typeof response === 'string') return { statusCode: status, message: response };
      const r = response as { message?: unknown; errors?: Record<string, string[]> };
      const message = Array.isArray(r.message) ? r.message.join('; ') : String(r.message ?? exception.message);
      // Nest turns body-parser's SyntaxError into a 400 carrying the parser's own wording.
      if (status === 400 && !r.errors && /JSON/.test(message) && /position|Unexpected|end of/i.test(message))
        return { statusCode: 400, message: 'The request body is not valid JSON.' };
      return r.errors ? { statusCode: status, message, errors: r.errors } : { statusCode: status, message };
    }
    // body-parser errors carry their own status (malformed JSON, body too large, bad charset).
    const e = exception as { type?: string; status?: number; statusCode?: number };
    if (e && typeof e.type === 'string' && (e.status ?? e.statusCode)) {
      const status = (e.status ?? e.statusCode) as number;
      if (e.type === 'entity.parse.failed')
        return { statusCode: 400, message: 'The request body is not valid JSON.' };
      if (e.type === 'entity.too.large') return { statusCode: 413, message: 'The request body is too large.' };
      return { statusCode: status < 500 ? status : 400, message: 'The request body could not be read.' };
    }
    if (exception instanceof UniqueConstraintViolationException)
      return { statusCode: HttpStatus.CONFLICT, message: 'That already exists.' };
    if (exception instanceof NotFoundError) return { statusCode: HttpStatus.NOT_FOUND, message: 'Not found.' };
    if (exception instanceof DriverException && /ER_DATA_TOO_LONG|ER_TRUNCATED/.test(String(exception.code)))
      return { statusCode: HttpStatus.BAD_REQUEST, message: 'A value is too long or malformed.' };
    return { statusCode: HttpStatus.INTERNAL_SERVER_ERROR, message: 'Something went wrong on our side. Please try again.' };
  }
}

/**
 * Framework and upload-library wording a member could not act on, put in plain words. Every upload
 * form takes files up to 20 MB except the roster import (5 MB).
 */
export function plainWords(body: ErrorBody, path: string): ErrorBody {
  const m = body.message;
  if (/^Validation failed \(.*(numeric|integer)/i.test(m))
    return { ...body, message: body.statusCode === 404 ? 'There is nothing at that address. Check the link.' : 'A number in the address is not a whole number.' };
  if (m === 'File too large') {
    const limit = path.includes('/roster-import') ? '5 MB' : '20 MB';
    return { ...body, statusCode: 413, message: `That file is larger than ${limit}. Choose a smaller one (a phone photo is usually 2 to 8 MB).` };
  }
  if (/^Unexpected file field|^Unexpected field/.test(m)) return { ...body, message: 'Send the file in the form’s own file field.' };
  if (m === 'Too many files') return { ...body, message: 'Send one file at a time.' };
  if (/^Too many (fields|parts)$|^Field (name|value) too long$/.test(m)) return { ...body, message: 'The upload carried more than the form asks for. Send only the file.' };
  if (/^Multipart: |^Malformed part header|^Unexpected end of (form|multipart data)/.test(m))
    return { ...body, statusCode: 400, message: 'The upload was cut off or malformed. Please try again.' };
  return body;
}
