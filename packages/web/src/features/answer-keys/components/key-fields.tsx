import type { Control, FieldErrors, UseFormRegister } from 'react-hook-form';

import { SelectField } from '../../../components/form/select-field';
import { TextField } from '../../../components/form/text-field';
import { KEY_KIND_LABEL, KEY_KINDS, type CourseOption, type KeyFieldsInput } from '../types';

/** What the key forms hold as text; {@link toKeyFields} turns it into the API's shape. */
export type KeyFieldValues = {
  title: string;
  kind: string;
  courseId: string;
  lessonNumber: string;
};

export const KEY_FIELD_NAMES = ['title', 'kind', 'courseId', 'lessonNumber'] as const;

export const emptyKeyFields: KeyFieldValues = {
  title: '',
  kind: '',
  courseId: '',
  lessonNumber: '',
};

export function keyFieldValues(key: KeyFieldsInput): KeyFieldValues {
  return {
    title: key.title,
    kind: key.kind,
    courseId: key.courseId === null ? '' : String(key.courseId),
    lessonNumber: key.lessonNumber === null ? '' : String(key.lessonNumber),
  };
}

export function toKeyFields(values: KeyFieldValues): KeyFieldsInput {
  return {
    title: values.title.trim(),
    kind: values.kind as KeyFieldsInput['kind'],
    courseId: values.courseId ? Number(values.courseId) : null,
    lessonNumber: values.courseId && values.lessonNumber ? Number(values.lessonNumber) : null,
  };
}

type KeyFieldsProps = {
  idPrefix: string;
  courses: readonly CourseOption[];
  register: UseFormRegister<KeyFieldValues>;
  control: Control<KeyFieldValues>;
  errors: FieldErrors<KeyFieldValues>;
  autoFocus?: boolean;
};

/** Title, kind, course and lesson of a key: shared by the new-key, import and editor forms. */
export function KeyFields({
  idPrefix,
  courses,
  register,
  control,
  errors,
  autoFocus,
}: KeyFieldsProps) {
  return (
    <div className="wb-key-fields">
      <TextField
        idPrefix={idPrefix}
        label="Title"
        help="As printed, e.g. “Worksheet 14” or “Test 3”."
        autoComplete="off"
        autoFocus={autoFocus}
        registration={register('title', {
          validate: (value) => value.trim().length > 0 || 'Give the key a title.',
          maxLength: { value: 120, message: 'Keep it under 120 characters.' },
        })}
        error={errors.title?.message}
      />
      <SelectField
        idPrefix={idPrefix}
        label="Kind"
        control={control}
        name="kind"
        rules={{ required: 'Choose worksheet, review or assessment.' }}
        options={[
          { value: '', label: 'Choose a kind' },
          ...KEY_KINDS.map((kind) => ({ value: kind, label: KEY_KIND_LABEL[kind] })),
        ]}
      />
      <SelectField
        idPrefix={idPrefix}
        label="Course (optional)"
        help="With a course, lessons to revisit are checked against its lessons."
        control={control}
        name="courseId"
        options={[
          { value: '', label: 'No course' },
          ...courses.map((course) => ({ value: String(course.id), label: course.name })),
        ]}
      />
      <TextField
        idPrefix={idPrefix}
        label="Lesson it goes with (optional)"
        inputMode="numeric"
        autoComplete="off"
        registration={register('lessonNumber', {
          validate: (value) =>
            value.trim() === '' ||
            (/^\d{1,4}$/.test(value.trim()) && Number(value) >= 1) ||
            'A lesson number, or leave it empty.',
        })}
        error={errors.lessonNumber?.message}
      />
    </div>
  );
}
