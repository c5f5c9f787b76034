import { ApiProperty } from '@nestjs/swagger';
import { IsString, Length } from 'class-validator';

export class ConfirmEmailVerificationDto {
  @ApiProperty({ description: 'The token from the link in the e-mail' })
  @IsString({ message: 'token must be the code from the link in the e-mail' })
  @Length(1, 200, { message: 'token must be the code from the link in the e-mail' })
  token: string;
}
