import { ApiProperty } from '@nestjs/swagger';
import { Equals, IsEmail, IsString, Length, Matches } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';

export class RegisterDto {
  @ApiProperty({ example: 'robin@example.test' })
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @Length(3, 254)
  email: string;

  @ApiProperty({ description: '8 to 128 characters; no composition rules', minLength: 8 })
  @IsString()
  @Length(8, 128, { message: 'password must be 8 to 128 characters' })
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
