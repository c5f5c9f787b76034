import { BadRequestException, ValidationPipe, type ValidationError } from '@nestjs/common';

/** `{ 'conditions.rested': 'must be a boolean' }` from class-validator's nested errors. */
export function flattenValidationErrors(
  errors: readonly ValidationError[],
  prefix = '',
): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const error of errors) {
    const path = prefix ? `${prefix}.${error.property}` : error.property;
    if (error.constraints) {
      const messages = Object.entries(error.constraints).map(([key, text]) =>
        key === 'whitelistValidation' ? `${path} is not a field we accept` : text,
      );
      fields[path] = messages.join('; ');
    }
    if (error.children?.length)
      Object.assign(fields, flattenValidationErrors(error.children, path));
  }
  return fields;
}

export function fieldsError(fields: Record<string, string>): BadRequestException {
  const names = Object.keys(fields);
  return new BadRequestException({
    message: `Please check ${names.join(', ')}: ${Object.values(fields)[0] ?? ''}`,
    fields,
  });
}

/** Whitelisting and unknown-field refusal for every DTO; errors name their fields. */
export function createValidationPipe(): ValidationPipe {
  return new ValidationPipe({
    whitelist: true,
    forbidNonWhitelisted: true,
    transform: true,
    forbidUnknownValues: true,
    stopAtFirstError: true,
    exceptionFactory: (errors) => fieldsError(flattenValidationErrors(errors)),
  });
}
