import { Body, Controller, Delete, Get, HttpCode, Req, Res } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import type { Request, Response } from 'express';
import { logOut, destroySession } from '../auth/session-lifetime.js';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import type { AppConfig } from '../config/app.config.js';
import { DeleteHouseholdDto } from './dto/delete-household.dto.js';
import { HouseholdDataService } from './household-data.service.js';
import { HouseholdDeletionService } from './household-deletion.service.js';

/** The owner's export of everything, and deletion of everything. */
@ApiTags('households')
@Roles(Role.owner)
@Controller()
export class HouseholdDataController {
  private readonly cookieName: string;

  constructor(
    private readonly data: HouseholdDataService,
    private readonly deletion: HouseholdDeletionService,
    config: ConfigService,
  ) {
    this.cookieName = config.getOrThrow<AppConfig>('app').session.cookieName;
  }

  @Get('export')
  @ApiOperation({ summary: 'A zip of the whole household: JSON per table, and the photos' })
  async export(@CurrentMember() member: MemberContext, @Res() res: Response): Promise<void> {
    const zip = await this.data.exportZip(member);
    const day = new Date().toISOString().slice(0, 10);
    res.setHeader('Content-Type', 'application/zip');
    res.setHeader('Content-Disposition', `attachment; filename="workback-export-${day}.zip"`);
    zip.outputStream.on('error', () => res.destroy());
    zip.outputStream.pipe(res);
  }

  @Delete('households/current')
  @HttpCode(200)
  @ApiOperation({ summary: 'Delete the household and all its data; body { confirm: "<name>" }' })
  async remove(
    @CurrentMember() member: MemberContext,
    @Body() dto: DeleteHouseholdDto,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ) {
    const summary = await this.deletion.deleteHousehold(member, dto.confirm);
    req.session.householdId = undefined;
    if (summary.yourAccountClosed) {
      await logOut(req);
      await destroySession(req);
      res.clearCookie(this.cookieName);
    }
    return summary;
  }
}
