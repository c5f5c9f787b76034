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

/** A route's access rules, as its decorators (and its controller's) set them. */
interface RouteRules {
  isPublic: boolean;
  adminOnly: boolean;
  noHousehold: boolean;
  roles: Role[] | undefined;
}

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

  /** Each route's rules, read once: decorators' metadata is fixed when the app starts. */
  private readonly rules = new WeakMap<object, WeakMap<object, RouteRules>>();

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const rules = this.rulesOf(context);
    if (rules.isPublic) return true;

    const req = context.switchToHttp().getRequest<Request>();
    if (!req.isAuthenticated() || !req.user) throw new UnauthorizedException('Please sign in');

    if (rules.adminOnly) {
      if (!req.user.isAdmin) throw new ForbiddenException('Only the site admin may do this');
      return true;
    }

    const member = await this.households.resolveMember(req.user.id, req.session.householdId);
    if (member) {
      req.member = member;
      req.session.householdId = member.householdId;
    }
    if (rules.noHousehold) return true;
    if (!member) {
      throw new ForbiddenException(
        req.user.isAdmin
          ? 'Site admins see no household or children’s data'
          : 'You are not a member of a household',
      );
    }

    if (rules.roles && !rules.roles.includes(member.role)) {
      throw new ForbiddenException(`A ${member.role} may not do this`);
    }
    return true;
  }

  /** Keyed by controller, then handler: a method a subclass inherits has its own class's rules. */
  private rulesOf(context: ExecutionContext): RouteRules {
    const controller = context.getClass();
    const handler = context.getHandler();
    let byHandler = this.rules.get(controller);
    if (!byHandler) this.rules.set(controller, (byHandler = new WeakMap()));
    let found = byHandler.get(handler);
    if (!found) {
      const targets = [handler, controller];
      const read = <T>(key: string) => this.reflector.getAllAndOverride<T>(key, targets);
      found = {
        isPublic: read<boolean>(IS_PUBLIC) === true,
        adminOnly: read<boolean>(ADMIN_ONLY) === true,
        noHousehold: read<boolean>(NO_HOUSEHOLD) === true,
        roles: read<Role[] | undefined>(ROLES_KEY),
      };
      byHandler.set(handler, found);
    }
    return found;
  }
}
