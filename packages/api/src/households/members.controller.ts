import { Body, Controller, Delete, Get, HttpCode, Patch } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { UpdateMemberDto } from './dto/update-member.dto.js';
import { MembersService } from './members.service.js';

@ApiTags('members')
@Roles(Role.owner, Role.parent)
@Controller('members')
export class MembersController {
  constructor(private readonly members: MembersService) {}

  @Get()
  findAll(@CurrentMember() member: MemberContext) {
    return this.members.findAll(member);
  }

  @Get(':id')
  findOne(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.members.findOne(member, id);
  }

  @Patch(':id')
  @ApiOperation({ summary: 'Change a member’s role, or a tutor’s studentIds' })
  update(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: UpdateMemberDto,
  ) {
    return this.members.update(member, id, dto);
  }

  @Delete(':id')
  @HttpCode(204)
  @ApiOperation({ summary: 'Revoke a membership (effective on that member’s next request)' })
  remove(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.members.remove(member, id);
  }
}
