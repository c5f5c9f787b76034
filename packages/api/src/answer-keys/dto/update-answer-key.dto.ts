import { ApiPropertyOptional, PartialType } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsString, Length, ValidateNested } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { AnswerKeyFieldsDto, MAX_KEY_ITEMS } from './create-answer-key.dto.js';
import { KeyItemUpdateDto } from './key-item.dto.js';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';

export class UpdateAnswerKeyDto extends PartialType(AnswerKeyFieldsDto) {
  @ApiPropertyOptional({
    type: [KeyItemUpdateDto],
    description:
      'The whole list of items: existing ones by id, new ones without. Items left out are removed.',
  })
  @IfPresent()
  @IsArray({ message: 'items must be a list' })
  @ArrayMaxSize(MAX_KEY_ITEMS, { message: `a key holds at most ${MAX_KEY_ITEMS} items` })
  @ValidateNested({ each: true })
  @Type(() => KeyItemUpdateDto)
  items?: KeyItemUpdateDto[];

  @ApiPropertyOptional({
    example: 'The printed key had a typo in item 12',
    description: 'Why the items changed; needed once the key has sittings',
  })
  @IfPresent()
  @Trim()
  @IsString()
  @Length(1, 300, { message: 'reason must be 1 to 300 characters' })
  reason?: string;
}
