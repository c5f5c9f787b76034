import { createParamDecorator, type ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';
import type { MemberContext, SessionUser } from '../member-context.js';

/** The signed-in member of the current household, set by AccessGuard. */
export const CurrentMember = createParamDecorator(
  (_data: unknown, ctx: ExecutionContext): MemberContext => {
    const member = ctx.switchToHttp().getRequest<Request>().member;
    if (!member) throw new Error('CurrentMember used on a route without a household');
    return member;
  },
);

export const CurrentUser = createParamDecorator(
  (_data: unknown, ctx: ExecutionContext): SessionUser =>
    ctx.switchToHttp().getRequest<Request>().user as SessionUser,
);
