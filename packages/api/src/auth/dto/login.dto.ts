import { ApiProperty } from '@nestjs/swagger';
import { IsEmail, IsString, Length } from 'class-validator';

export class LoginDto {
  @ApiProperty({ example: 'parent@workback.test' })
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @Length(3, 254)
  email: string;

  @ApiProperty({ example: 'workback-demo', minLength: 1, maxLength: 128 })
  @IsString()
  @Length(1, 128, { message: 'password must be 1 to 128 characters' })
  password: string;
}
