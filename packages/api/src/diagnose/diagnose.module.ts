import { Module } from '@nestjs/common';
import { DiagnoseController } from './diagnose.controller.js';
import { DiagnoseService } from './diagnose.service.js';

@Module({
  controllers: [DiagnoseController],
  providers: [DiagnoseService],
  exports: [DiagnoseService],
})
export class DiagnoseModule {}
