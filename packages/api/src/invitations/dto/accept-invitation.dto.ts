import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsEmail, IsString, Length, Matches } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';
import { IsNewPassword, NEW_PASSWORD_RULES } from '../../auth/password-policy.js';

/** Empty when signed in; a new person sends displayName and password (and may choose the e-mail). */
export class AcceptInvitationDto {
  @ApiPropertyOptional({ example: 'Sam' })
  @IfPresent()
  @Trim()
  @IsString()
  @Length(1, 80, { message: 'displayName must be 1 to 80 characters' })
  @Matches(/\S/, { message: 'displayName must not be blank' })
  displayName?: string;

  @ApiPropertyOptional({ description: NEW_PASSWORD_RULES, minLength: 8, maxLength: 128 })
  @IfPresent()
  @IsNewPassword()
  password?: string;

  @ApiPropertyOptional({ description: 'Defaults to the address the invitation was sent to' })
  @IfPresent()
  @Trim()
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @Length(3, 254, { message: 'email must be an e-mail address' })
  email?: string;
}
