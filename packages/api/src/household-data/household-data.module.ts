import { Module } from '@nestjs/common';
import { HouseholdsModule } from '../households/households.module.js';
import { StorageModule } from '../storage/storage.module.js';
import { HouseholdDataController } from './household-data.controller.js';
import { HouseholdDataService } from './household-data.service.js';
import { HouseholdDeletionService } from './household-deletion.service.js';

@Module({
  imports: [HouseholdsModule, StorageModule],
  controllers: [HouseholdDataController],
  providers: [HouseholdDataService, HouseholdDeletionService],
})
export class HouseholdDataModule {}
