import { BadRequestException, ExecutionContext, Injectable } from '@nestjs/common';
import { AuthGuard } from '@nestjs/passport';
import { plainToInstance } from 'class-transformer';
import { validate } from 'class-validator';
import type { Request } from 'express';
import { assertFormBody, fieldErrors } from '../common/pipes/validation';
import { SignInDto } from './dto/sign-in.dto';

/**
 * Guards run before pipes, so the body is validated here first: a malformed sign-in gets the same
 * field-keyed 400 as any form, not passport's bare 401. Then passport-local checks the password
 * and `logIn` starts a session under a fresh id.
 */
@Injectable()
export class LocalAuthGuard extends AuthGuard('local') {
  async canActivate(context: ExecutionContext): Promise<boolean> {
    const req = context.switchToHttp().getRequest<Request>();
    assertFormBody(req.body);
    const dto = plainToInstance(SignInDto, req.body ?? {});
    const errors = await validate(dto, { whitelist: true, forbidNonWhitelisted: true });
    if (errors.length)
      throw new BadRequestException({ message: 'Please check the highlighted fields.', errors: fieldErrors(errors) });
    const ok = (await super.canActivate(context)) as boolean;
    await super.logIn(req);
    return ok;
  }
}
