import { ApiProperty } from '@nestjs/swagger';
import { Equals, IsEmail, IsString, Length, Matches } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { IsNewPassword, NEW_PASSWORD_RULES } from '../password-policy.js';

export class RegisterDto {
  @ApiProperty({ example: 'robin@example.test' })
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @Length(3, 254)
  email: string;

  @ApiProperty({ description: NEW_PASSWORD_RULES, minLength: 8, maxLength: 128 })
  @IsNewPassword()
  password: string;

  @ApiProperty({ example: 'Robin' })
  @Trim()
  @IsString()
  @Length(1, 80, { message: 'displayName must be 1 to 80 characters' })
  @Matches(/\S/, { message: 'displayName must not be blank' })
  displayName: string;

  @ApiProperty({ example: 'The Lane household' })
  @Trim()
  @IsString()
  @Length(1, 80, { message: 'householdName must be 1 to 80 characters' })
  @Matches(/\S/, { message: 'householdName must not be blank' })
  householdName: string;

  @ApiProperty({
    description: 'The person signing up confirms they are an adult and the parent or guardian',
  })
  @Equals(true, { message: 'adultConfirmed must be true: accounts are for parents and guardians' })
  adultConfirmed: boolean;
}
