import {
  type CanActivate,
  type ExecutionContext,
  ForbiddenException,
  Injectable,
  UnauthorizedException,
} from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Role } from '@workback/core';
import type { Request } from 'express';
import { HouseholdsService } from '../../households/households.service.js';
import { IS_PUBLIC, NO_HOUSEHOLD } from '../decorators/public.decorator.js';
import { ADMIN_ONLY, ROLES_KEY } from '../decorators/roles.decorator.js';

/**
 * Protected by default: signed in, then a membership of the session's household
 * (through MemberCache, emptied by every change to memberships or grants, so a
 * revoked member is out at their next request), then the
 * route's roles. Data scoping itself happens in each service's queries.
 */
@Injectable()
export class AccessGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly households: HouseholdsService,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const targets = [context.getHandler(), context.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, targets)) return true;

    const req = context.switchToHttp().getRequest<Request>();
    if (!req.isAuthenticated() || !req.user) throw new UnauthorizedException('Please sign in');

    if (this.reflector.getAllAndOverride<boolean>(ADMIN_ONLY, targets)) {
      if (!req.user.isAdmin) throw new ForbiddenException('Only the site admin may do this');
      return true;
    }

    const member = await this.households.resolveMember(req.user.id, req.session.householdId);
    if (member) {
      req.member = member;
      req.session.householdId = member.householdId;
    }
    if (this.reflector.getAllAndOverride<boolean>(NO_HOUSEHOLD, targets)) return true;
    if (!member) {
      throw new ForbiddenException(
        req.user.isAdmin
          ? 'Site admins see no household or children’s data'
          : 'You are not a member of a household',
      );
    }

    const roles = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, targets);
    if (roles && !roles.includes(member.role)) {
      throw new ForbiddenException(`A ${member.role} may not do this`);
    }
    return true;
  }
}
