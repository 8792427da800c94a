import { IsEmail, IsIn, IsBoolean, IsString, Length, Matches, MaxLength, MinLength, ValidateIf } from 'class-validator';
import { roles, type Role } from '../roles';

import { passwordMaxLength, passwordMinLength } from '../password-rules';

export class LoginDto {
  @IsEmail({}, { message: 'Enter a valid e-mail address.' })
  @MaxLength(254, { message: 'An e-mail address has at most 254 characters.' })
  email!: string;

  @IsString({ message: 'Enter your password.' })
  @Length(1, 200, { message: 'Enter your password (at most 200 characters).' })
  password!: string;
}

export class RegisterDto {
  @IsEmail({}, { message: 'Enter a valid e-mail address.' })
  @MaxLength(254, { message: 'An e-mail address has at most 254 characters.' })
  email!: string;

  @IsString({ message: 'Choose a password.' })
  @MinLength(passwordMinLength, { message: `A password has at least ${passwordMinLength} characters.` })
  @MaxLength(passwordMaxLength, { message: `A password has at most ${passwordMaxLength} characters.` })
  password!: string;

  @IsString({ message: 'Enter your name.' })
  @Length(1, 80, { message: 'A name has 1 to 80 characters.' })
  @Matches(/\S/, { message: 'Enter your name.' })
  displayName!: string;
}

export class CreateUserDto extends RegisterDto {
  @IsIn(roles as unknown as string[], { message: `Role must be one of ${roles.join(', ')}.` })
  role!: Role;
}

// A partial update: a field left out stays as it is, but null is not a value any of these may take.
const given = (_o: object, v: unknown) => v !== undefined;

export class UpdateUserDto {
  @ValidateIf(given)
  @IsIn(roles as unknown as string[], { message: `Role must be one of ${roles.join(', ')}.` })
  role?: Role;

  @ValidateIf(given)
  @IsBoolean({ message: 'Disabled is true or false.' })
  disabled?: boolean;

  @ValidateIf(given)
  @IsString({ message: 'Enter a name.' })
  @Length(1, 80, { message: 'A name has 1 to 80 characters.' })
  @Matches(/\S/, { message: 'Enter a name.' })
  displayName?: string;
}

export class PasswordResetRequestDto {
  @IsEmail({}, { message: 'Enter a valid e-mail address.' })
  @MaxLength(254, { message: 'An e-mail address has at most 254 characters.' })
  email!: string;
}

export class PasswordResetConfirmDto {
  @IsString({ message: 'The reset link is missing its token.' })
  @Length(20, 200, { message: 'The reset token is not valid.' })
  token!: string;

  @IsString({ message: 'Choose a password.' })
  @MinLength(passwordMinLength, { message: `A password has at least ${passwordMinLength} characters.` })
  @MaxLength(passwordMaxLength, { message: `A password has at most ${passwordMaxLength} characters.` })
  password!: string;
}
