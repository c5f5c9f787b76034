import { Body, Controller, HttpCode, Post, UnprocessableEntityException } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { DiagnoseService } from './diagnose.service.js';
import { DiagnoseDto } from './dto/diagnose.dto.js';

@ApiTags('diagnose')
@Controller('diagnose')
export class DiagnoseController {
  constructor(private readonly diagnoser: DiagnoseService) {}

  /** The live preview of the Log-a-miss form: the engine's Diagnosis JSON, or 422 naming the part it could not read. */
  @Post()
  @HttpCode(200)
  run(@Body() dto: DiagnoseDto) {
    const result = this.diagnoser.check(dto.problem, dto.answer, dto.steps);
    if (result.checked) return result.diagnosis;
    throw new UnprocessableEntityException({
      message: result.reason,
      fields: { [result.part]: result.reason },
    });
  }
}
