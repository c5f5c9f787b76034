import { describe, expect, it } from 'vitest';
import { validateEnv } from './env.validation.js';

describe('validateEnv: HELPER_THREAD_NICENESS', () => {
  it('defaults to 10 and takes a whole number from 0 to 19', () => {
    expect(validateEnv({}).HELPER_THREAD_NICENESS).toBe(10);
    expect(validateEnv({ HELPER_THREAD_NICENESS: '0' }).HELPER_THREAD_NICENESS).toBe(0);
    expect(validateEnv({ HELPER_THREAD_NICENESS: '19' }).HELPER_THREAD_NICENESS).toBe(19);
  });

  it('refuses anything else, naming the variable', () => {
    // setpriority(2): nice values run from -20 to 19, and only a privileged process may lower
    // one (from memory).
    expect(() => validateEnv({ HELPER_THREAD_NICENESS: '20' })).toThrow(
      /HELPER_THREAD_NICENESS: .*must not be greater than 19/,
    );
    expect(() => validateEnv({ HELPER_THREAD_NICENESS: '-1' })).toThrow(
      /HELPER_THREAD_NICENESS: .*must not be less than 0/,
    );
    expect(() => validateEnv({ HELPER_THREAD_NICENESS: 'high' })).toThrow(
      /HELPER_THREAD_NICENESS: .*must be an integer/,
    );
  });
});
