import { type ExecutionContext, Injectable } from '@nestjs/common';
import { AuthGuard } from '@nestjs/passport';
import { plainToInstance } from 'class-transformer';
import { validate } from 'class-validator';
import type { Request } from 'express';
import {
  fieldsError,
  flattenValidationErrors,
  refuseControlCharacters,
  refuseDeepNesting,
} from '../common/pipes/validation.pipe.js';
import { LoginDto } from './dto/login.dto.js';

/** Checks the body's shape first (guards run before pipes), then signs in via passport-local. */
@Injectable()
export class LocalAuthGuard extends AuthGuard('local') {
  override async canActivate(context: ExecutionContext): Promise<boolean> {
    const req = context.switchToHttp().getRequest<Request>();
    refuseDeepNesting(req.body);
    const dto = plainToInstance(LoginDto, req.body ?? {});
    refuseControlCharacters(dto);
    const errors = await validate(dto, { whitelist: true, forbidNonWhitelisted: true });
    if (errors.length > 0) throw fieldsError(flattenValidationErrors(errors));
    const ok = (await super.canActivate(context)) as boolean;
    await super.logIn(req);
    return ok;
  }
}
