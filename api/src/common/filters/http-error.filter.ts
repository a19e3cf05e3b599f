import { DriverException, NotFoundError, UniqueConstraintViolationException } from '@mikro-orm/core';
import { ArgumentsHost, Catch, ExceptionFilter, HttpException, HttpStatus, Logger } from '@nestjs/common';
import type { Response } from 'express';

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
    const body = this.toBody(exception);
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
