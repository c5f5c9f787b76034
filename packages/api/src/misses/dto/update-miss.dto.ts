import { PartialType } from '@nestjs/swagger';
import { CreateMissDto } from './create-miss.dto.js';

/** Every field optional; `null` is refused except for `steps` (which clears them). */
export class UpdateMissDto extends PartialType(CreateMissDto, { skipNullProperties: false }) {}
