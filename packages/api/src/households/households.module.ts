import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { HouseholdsController } from './households.controller.js';
import { HouseholdsService } from './households.service.js';
import { Household } from './models/household.model.js';
import { Membership } from './models/membership.model.js';
import { StudentGrant } from './models/student-grant.model.js';

@Module({
  imports: [SequelizeModule.forFeature([Household, Membership, StudentGrant])],
  controllers: [HouseholdsController],
  providers: [HouseholdsService],
  exports: [HouseholdsService],
})
export class HouseholdsModule {}
