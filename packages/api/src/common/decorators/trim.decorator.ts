import { Transform } from 'class-transformer';

/** Trims strings before validation; leaves other types for the validators to refuse. */
export const Trim = () =>
  Transform(({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value));
