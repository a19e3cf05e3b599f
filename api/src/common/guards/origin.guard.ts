import { CanActivate, ExecutionContext, ForbiddenException, Inject, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { appConfig, type AppConfig } from '../../config/app.config';
import { SKIP_ORIGIN_CHECK } from '../decorators/skip-origin-check.decorator';
import { checkRequestOrigin } from '../middleware/origin-check';

@Injectable()
export class OriginGuard implements CanActivate {
  private readonly allowed: string[];

  constructor(
    private readonly reflector: Reflector,
    @Inject(appConfig.KEY) app: AppConfig,
  ) {
    this.allowed = [app.origin, ...app.extraOrigins].map((o) => new URL(o).origin);
  }

  canActivate(context: ExecutionContext): boolean {
    if (this.reflector.getAllAndOverride<boolean>(SKIP_ORIGIN_CHECK, [context.getHandler(), context.getClass()]))
      return true;
    const req = context.switchToHttp().getRequest<Request>();
    const verdict = checkRequestOrigin(req.method, req.headers as Record<string, string>, this.allowed);
    if (!verdict.ok) throw new ForbiddenException(`Cross-site request refused: ${verdict.reason}.`);
    return true;
  }
}
