import { Controller, Get } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { HouseholdsService } from './households.service.js';

@ApiTags('households')
@Controller('households')
export class HouseholdsController {
  constructor(private readonly households: HouseholdsService) {}

  @Get('current')
  findCurrent(@CurrentMember() member: MemberContext) {
    return this.households.findCurrent(member);
  }
}
