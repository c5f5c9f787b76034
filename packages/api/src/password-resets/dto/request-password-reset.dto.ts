import { ApiProperty } from '@nestjs/swagger';
import { IsEmail, Length } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';

export class RequestPasswordResetDto {
  @ApiProperty({ example: 'parent@workback.test' })
  @Trim()
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @Length(3, 254, { message: 'email must be an e-mail address' })
  email: string;
}
