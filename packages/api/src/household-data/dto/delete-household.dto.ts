import { ApiProperty } from '@nestjs/swagger';
import { IsString, MaxLength } from 'class-validator';

export class DeleteHouseholdDto {
  @ApiProperty({ description: 'The household’s name, typed again to confirm' })
  @IsString({ message: 'confirm must be the household’s name, typed again' })
  @MaxLength(200, { message: 'confirm must be the household’s name, typed again' })
  confirm: string;
}
