import {
  ValidatorConstraint,
  type ValidationArguments,
  type ValidatorConstraintInterface,
} from 'class-validator';

const DAY_MS = 86_400_000;

/** A real calendar day as YYYY-MM-DD, not more than a day ahead (time zones). */
export function checkCalendarDate(
  value: unknown,
  { allowFuture = false, now = Date.now() } = {},
): string | null {
  if (typeof value !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(value)) {
    return 'must be a date written YYYY-MM-DD';
  }
  const time = Date.parse(`${value}T00:00:00Z`);
  if (Number.isNaN(time) || new Date(time).toISOString().slice(0, 10) !== value) {
    return 'must be a real calendar date';
  }
  if (!allowFuture && time > now + DAY_MS) return 'must not be in the future';
  if (value < '2000-01-01') return 'must be in this century';
  return null;
}

@ValidatorConstraint({ name: 'calendarDate' })
export class CalendarDate implements ValidatorConstraintInterface {
  validate(value: unknown, args: ValidationArguments): boolean {
    return checkCalendarDate(value, options(args)) === null;
  }

  defaultMessage(args: ValidationArguments): string {
    return `${args.property} ${checkCalendarDate(args.value, options(args)) ?? 'is not valid'}`;
  }
}

function options(args: ValidationArguments): { allowFuture?: boolean } {
  return (args.constraints?.[0] as { allowFuture?: boolean } | undefined) ?? {};
}
