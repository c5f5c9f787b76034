import { ValidateIf } from 'class-validator';

/**
 * Optional, but not nullable: skips validation only when the field is absent.
 * class-validator's IsOptional also lets `null` through, which then reaches the
 * models as "clear this required value" and fails there.
 */
export const IfPresent = () => ValidateIf((_object: object, value: unknown) => value !== undefined);
