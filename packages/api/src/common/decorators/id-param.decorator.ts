import { Param, ParseIntPipe } from '@nestjs/common';
import { fieldsError } from '../pipes/validation.pipe.js';

/** A positive integer route id; anything else is a 400 naming the parameter. */
export const IdParam = (name = 'id') =>
  Param(
    name,
    new ParseIntPipe({
      exceptionFactory: () => fieldsError({ [name]: `${name} must be a whole number` }),
    }),
  );
