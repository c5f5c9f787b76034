import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { StudentsModule } from '../students/students.module.js';
import { HouseholdsController } from './households.controller.js';
import { HouseholdsService } from './households.service.js';
import { MemberCache } from './member-cache.js';
import { MembersController } from './members.controller.js';
import { MembersService } from './members.service.js';
import { Household } from './models/household.model.js';
import { Membership } from './models/membership.model.js';
import { StudentGrant } from './models/student-grant.model.js';

@Module({
  imports: [SequelizeModule.forFeature([Household, Membership, StudentGrant]), StudentsModule],
  controllers: [HouseholdsController, MembersController],
  providers: [HouseholdsService, MembersService, MemberCache],
  exports: [HouseholdsService, MembersService, MemberCache],
})
export class HouseholdsModule {}
