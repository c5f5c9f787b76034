import { getMetadataStorage, ValidateBy } from 'class-validator';

export const MULTI_LINE = 'multiLine';

/** Control characters a text field may never hold (tab and line feed are allowed by `@MultiLine()`). */
// Matching control characters is the point of these two.
// eslint-disable-next-line no-control-regex
export const CONTROL_CHARS = /[\u0000-\u001f\u007f-\u009f]/;
// eslint-disable-next-line no-control-regex
export const CONTROL_CHARS_BUT_LINES = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/;

/**
 * A text field that may keep line breaks (\n) and tabs (\t). Every other text field, and every
 * query parameter, holds no control characters at all: `WorkbackValidationPipe` refuses them
 * before validation.
 */
export const MultiLine = () =>
  ValidateBy({
    name: MULTI_LINE,
    validator: {
      validate: (value: unknown) =>
        typeof value !== 'string' || !CONTROL_CHARS_BUT_LINES.test(value),
      defaultMessage: (args) =>
        `${args?.property ?? 'text'} may hold line breaks and tabs but no other control characters`,
    },
  });

const multiLineCache = new WeakMap<object, ReadonlySet<string>>();

/** The properties of a DTO class marked `@MultiLine()` (PartialType copies the marks). */
export function multiLineProperties(target: object): ReadonlySet<string> {
  let names = multiLineCache.get(target);
  if (!names) {
    const metadata = getMetadataStorage().getTargetValidationMetadatas(
      target as new () => unknown,
      '',
      true,
      false,
    );
    names = new Set(metadata.filter((m) => m.name === MULTI_LINE).map((m) => m.propertyName));
    multiLineCache.set(target, names);
  }
  return names;
}
