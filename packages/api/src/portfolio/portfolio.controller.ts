import { Controller, Get, Query, StreamableFile } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { PortfolioQuery } from './dto/portfolio.query.js';
import { PortfolioService } from './portfolio.service.js';

@ApiTags('portfolio')
@Controller('students')
export class PortfolioController {
  constructor(private readonly portfolio: PortfolioService) {}

  @Get(':id/portfolio.pdf')
  async pdf(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Query() query: PortfolioQuery,
  ) {
    const { filename, body } = await this.portfolio.pdf(member, id, query);
    return new StreamableFile(body, {
      type: 'application/pdf',
      disposition: `attachment; filename="${filename}"`,
    });
  }
}
