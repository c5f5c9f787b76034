import { ApiProperty } from '@nestjs/swagger';
import { IsString, Length } from 'class-validator';
import { IsNewPassword, NEW_PASSWORD_RULES } from '../../auth/password-policy.js';

export class ConfirmPasswordResetDto {
  @ApiProperty({ description: 'The token from the link in the e-mail' })
  @IsString({ message: 'token must be the code from the link in the e-mail' })
  @Length(1, 200, { message: 'token must be the code from the link in the e-mail' })
  token: string;

  @ApiProperty({ description: NEW_PASSWORD_RULES, minLength: 8, maxLength: 128 })
  @IsNewPassword()
  password: string;
}
