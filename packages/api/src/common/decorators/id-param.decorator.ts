import { Param, type PipeTransform } from '@nestjs/common';
import { Transform } from 'class-transformer';
import { fieldsError } from '../pipes/validation.pipe.js';
import { WHOLE_NUMBER_TEXT } from './whole-number.js';

export { WHOLE_NUMBER_TEXT };

/**
 * Query and form fields arrive as text: `'19'` becomes 19, anything else is left as it came for
 * `@IsInt()` to refuse (in place of `@Type(() => Number)`, which reads `0x13` as 19).
 */
export const WholeNumber = () =>
  Transform(({ value }: { value: unknown }) =>
    typeof value === 'string' && WHOLE_NUMBER_TEXT.test(value) ? Number(value) : value,
  );

/** The global pipe has already refused text that is not plain digits, and made a number of it. */
class ParseIdPipe implements PipeTransform<string | number, number> {
  constructor(private readonly name: string) {}

  transform(value: string | number): number {
    const id =
      typeof value === 'number' ? value : WHOLE_NUMBER_TEXT.test(value) ? Number(value) : 0;
    if (!Number.isSafeInteger(id) || id < 1)
      throw fieldsError({ [this.name]: `${this.name} must be a whole number` });
    return id;
  }
}

/** A positive integer route id; anything else is a 400 naming the parameter. */
export const IdParam = (name = 'id') => Param(name, new ParseIdPipe(name));
