import { ApiProperty } from '@nestjs/swagger';
import { IsInt, Min } from 'class-validator';

export class SwitchHouseholdDto {
  @ApiProperty({ description: 'One of the households listed by GET /api/auth/me' })
  @IsInt({ message: 'householdId must be a whole number' })
  @Min(1, { message: 'householdId must be a whole number' })
  householdId: number;
}
