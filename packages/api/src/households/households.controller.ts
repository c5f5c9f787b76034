import { Body, Controller, Get, HttpCode, Post, Req } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import type { Request } from 'express';
import { CurrentMember, CurrentUser } from '../common/decorators/current-member.decorator.js';
import { AllowNoHousehold } from '../common/decorators/public.decorator.js';
import type { MemberContext, SessionUser } from '../common/member-context.js';
import { SwitchHouseholdDto } from './dto/switch-household.dto.js';
import { HouseholdsService } from './households.service.js';

@ApiTags('households')
@Controller('households')
export class HouseholdsController {
  constructor(private readonly households: HouseholdsService) {}

  @Get('current')
  findCurrent(@CurrentMember() member: MemberContext) {
    return this.households.findCurrent(member);
  }

  @AllowNoHousehold()
  @Post('current')
  @HttpCode(200)
  @ApiOperation({ summary: 'Switch this session to another of your households' })
  async switchCurrent(
    @CurrentUser() user: SessionUser,
    @Body() dto: SwitchHouseholdDto,
    @Req() req: Request,
  ) {
    await this.households.findMembershipOf(user.id, dto.householdId);
    req.session.householdId = dto.householdId;
    const member = await this.households.resolveMember(user.id, dto.householdId);
    return this.households.findCurrent(member!);
  }
}
