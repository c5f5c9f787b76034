import {
  type ArgumentMetadata,
  BadRequestException,
  ValidationPipe,
  type ValidationError,
} from '@nestjs/common';
import type { ValidatorOptions } from 'class-validator';
import { LRUCache } from 'lru-cache';
import {
  CONTROL_CHARS,
  CONTROL_CHARS_BUT_LINES,
  multiLineProperties,
} from '../decorators/multi-line.decorator.js';
import { WHOLE_NUMBER_TEXT } from '../decorators/whole-number.js';

/** Deeper request bodies are refused before class-transformer walks them (recursively). */
export const MAX_NESTING = 32;

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

/** The first place, breadth first, where `value` nests deeper than MAX_NESTING (no recursion). */
export function tooDeep(value: unknown): string | undefined {
  let level: { value: unknown; path: string }[] = [{ value, path: '' }];
  for (let depth = 0; level.length > 0; depth++) {
    const next: { value: unknown; path: string }[] = [];
    for (const item of level) {
      if (item.value === null || typeof item.value !== 'object') continue;
      if (depth >= MAX_NESTING) return item.path || 'body';
      for (const [key, child] of Object.entries(item.value)) {
        next.push({ value: child, path: item.path || key });
      }
    }
    level = next;
  }
  return undefined;
}

/**
 * The first text in a transformed DTO that holds a control character: none anywhere, but
 * `@MultiLine()` fields keep \n and \t. Nested DTOs carry their own marks; plain objects
 * and arrays inherit their property's.
 */
export function controlCharacterAt(
  value: unknown,
  path = '',
  multiLine = false,
): { path: string; multiLine: boolean } | undefined {
  const stack: { value: unknown; path: string; multiLine: boolean }[] = [
    { value, path, multiLine },
  ];
  while (stack.length > 0) {
    const item = stack.pop()!;
    if (typeof item.value === 'string') {
      const refused = item.multiLine ? CONTROL_CHARS_BUT_LINES : CONTROL_CHARS;
      if (refused.test(item.value))
        return { path: item.path || 'value', multiLine: item.multiLine };
      continue;
    }
    if (item.value === null || typeof item.value !== 'object') continue;
    const proto = Object.getPrototypeOf(item.value) as { constructor?: object } | null;
    const isDto = proto !== null && proto !== Object.prototype && proto !== Array.prototype;
    const marked = isDto && proto.constructor ? multiLineProperties(proto.constructor) : undefined;
    for (const [key, child] of Object.entries(item.value)) {
      if (key === 'constructor') continue;
      stack.push({
        value: child,
        path: item.path ? `${item.path}.${key}` : key,
        multiLine: marked ? marked.has(key) : item.multiLine,
      });
    }
  }
  return undefined;
}

/** Refuses (400, naming the field) a value nested deeper than MAX_NESTING. */
export function refuseDeepNesting(value: unknown): void {
  const deep = tooDeep(value);
  if (deep !== undefined) {
    throw fieldsError({ [deep]: `${deep} is nested too deeply (at most ${MAX_NESTING} levels)` });
  }
}

/** Refuses (400, naming the field) the first text holding a control character. */
export function refuseControlCharacters(value: unknown, path = ''): void {
  const found = controlCharacterAt(value, path);
  if (!found) return;
  throw fieldsError({
    [found.path]: found.multiLine
      ? `${found.path} may hold line breaks and tabs but no other control characters`
      : `${found.path} must not hold control characters (such as NUL, tabs or line breaks)`,
  });
}

/**
 * Nest's ValidationPipe with two checks in front: nesting depth before class-transformer runs,
 * and control characters in every text field and query parameter before class-validator runs.
 */
export class WorkbackValidationPipe extends ValidationPipe {
  /**
   * Query DTOs as last checked, by class and query text: a notebook asks for the same few pages
   * and filters again and again, and transforming and validating them was a tenth of a kept
   * page's cost. Checking is a pure function of the text, so a kept result stands; refusals are
   * never kept. Each request gets its own copy.
   */
  private readonly queries = new WeakMap<object, LRUCache<string, object>>();

  override async transform(value: unknown, metadata: ArgumentMetadata): Promise<unknown> {
    if (metadata.type === 'custom') return super.transform(value, metadata);
    if (metadata.type === 'query' && metadata.metatype && typeof value === 'object' && value) {
      return this.checkedQuery(value, metadata);
    }
    return this.check(value, metadata);
  }

  private async checkedQuery(value: object, metadata: ArgumentMetadata): Promise<unknown> {
    let ofClass = this.queries.get(metadata.metatype!);
    if (!ofClass) this.queries.set(metadata.metatype!, (ofClass = new LRUCache({ max: 500 })));
    const key = `${metadata.data ?? ''}\u0000${JSON.stringify(value)}`;
    let kept = ofClass.get(key);
    if (!kept) {
      const checked: unknown = await this.check(value, metadata);
      if (typeof checked !== 'object' || checked === null) return checked;
      ofClass.set(key, (kept = checked));
    }
    return Object.assign(Object.create(Object.getPrototypeOf(kept) as object) as object, kept);
  }

  private async check(value: unknown, metadata: ArgumentMetadata): Promise<unknown> {
    refuseDeepNesting(value);
    if (typeof value === 'string' || Array.isArray(value)) {
      // A bare @Query('x') or @Param('x'): no DTO to carry marks, so no control characters.
      const name = metadata.data ?? metadata.type;
      refuseControlCharacters(value, name);
      // Nest would read `0x13` or `1e1` as a number; here only plain digits are one.
      if (metadata.metatype === Number && typeof value === 'string') {
        if (!WHOLE_NUMBER_TEXT.test(value))
          throw fieldsError({ [name]: `${name} must be a whole number` });
        return Number(value);
      }
    }
    return super.transform(value, metadata);
  }

  protected override validate(
    object: object,
    validatorOptions?: ValidatorOptions,
  ): Promise<ValidationError[]> | ValidationError[] {
    refuseControlCharacters(object);
    return super.validate(object, validatorOptions);
  }
}

/** Whitelisting and unknown-field refusal for every DTO; errors name their fields. */
export function createValidationPipe(): ValidationPipe {
  return new WorkbackValidationPipe({
    whitelist: true,
    forbidNonWhitelisted: true,
    transform: true,
    forbidUnknownValues: true,
    stopAtFirstError: true,
    exceptionFactory: (errors) => fieldsError(flattenValidationErrors(errors)),
  });
}
