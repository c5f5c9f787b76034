import { ApiProperty } from '@nestjs/swagger';
import { IsString, Length } from 'class-validator';

export class ConfirmPasswordResetDto {
  @ApiProperty({ description: 'The token from the link in the e-mail' })
  @IsString({ message: 'token must be the code from the link in the e-mail' })
  @Length(1, 200, { message: 'token must be the code from the link in the e-mail' })
  token: string;

  @ApiProperty({ description: '8 to 128 characters; no composition rules', minLength: 8 })
  @IsString()
  @Length(8, 128, { message: 'password must be 8 to 128 characters' })
  password: string;
}
