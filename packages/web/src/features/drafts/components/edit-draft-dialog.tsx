import { Button, Dialog } from '@blueprintjs/core';
import { CrossIcon } from '@blueprintjs/icons';
import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';

import { DialogForm } from '../../../components/form/dialog-form';
import { SelectField } from '../../../components/form/select-field';
import { TextAreaField } from '../../../components/form/text-area-field';
import { TextField } from '../../../components/form/text-field';
import { newDraftKey, replaceDraft, type Draft } from '../drafts-store';
import { missFieldRules } from '../../misses/utils/miss-field-rules';

type Values = {
  studentId: string;
  occurredOn: string;
  problem: string;
  answer: string;
  explanation: string;
  note: string;
  lines: string;
};

/** The fields this dialog shows; a refusal naming another one is told above them. */
const SHOWN: readonly (keyof Values)[] = [
  'studentId',
  'occurredOn',
  'problem',
  'answer',
  'explanation',
  'note',
  'lines',
];

const FIELD_WORDS: Record<string, string> = {
  photos: 'the photos',
  cause: 'the cause',
  stage: 'the word problem’s stage',
  steps: 'the written steps',
  'idempotency-key': 'this copy',
};

/** The day as the waiting list shows it: `2 Nov 2026`. */
function dayWords(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  if (!y || !m || !d) return day;
  return new Date(y, m - 1, d).toLocaleDateString(undefined, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
  });
}

function linesOf(text: string | undefined): string {
  if (!text) return '';
  try {
    const list = JSON.parse(text) as unknown;
    return Array.isArray(list) ? list.map(String).join('\n') : text;
  } catch {
    return text;
  }
}

/** The API names a bad line `lines.2` (the third): shown under the lines box. */
function fieldErrors(fields: Record<string, string>): Map<string, string> {
  const out = new Map<string, string>();
  for (const [name, message] of Object.entries(fields)) {
    const line = /^lines\.(\d+)$/.exec(name)?.[1];
    if (line !== undefined) {
      if (!out.has('lines')) out.set('lines', `Line ${Number(line) + 1}: ${message}`);
    } else out.set(name, message);
  }
  return out;
}

/**
 * A waiting miss the server refused, opened to put right: the fields it named show its words
 * beside them. "Send again" puts the corrected copy back in the queue (with a new key only when
 * the old one was used for other content); it goes as soon as there is a connection.
 */
export default function EditDraftDialog({
  draft,
  students,
  onClose,
}: {
  draft: Draft;
  students: readonly { id: number; name: string }[];
  onClose: () => void;
}) {
  const errors = fieldErrors(draft.refusalFields ?? {});
  const [photos, setPhotos] = useState(draft.photos);
  const [error, setFormError] = useState<string | null>(null);
  const hasLines = draft.fields.lines !== undefined;
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors: shown, isSubmitting },
  } = useForm<Values>({
    defaultValues: {
      studentId: draft.fields.studentId ?? '',
      occurredOn: draft.fields.occurredOn ?? '',
      problem: draft.fields.problem ?? '',
      answer: draft.fields.answer ?? '',
      explanation: draft.fields.explanation ?? '',
      note: draft.fields.note ?? '',
      lines: linesOf(draft.fields.lines),
    },
  });

  useEffect(() => {
    for (const name of SHOWN) {
      const message = errors.get(name);
      if (message) setError(name, { type: 'server', message }, { shouldFocus: true });
    }
    // Once, when the dialog opens: later edits clear each field's message as usual.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  const elsewhere = [...errors].filter(([name]) => !(SHOWN as readonly string[]).includes(name));
  const options = students.some((s) => String(s.id) === draft.fields.studentId)
    ? students
    : [{ id: Number(draft.fields.studentId), name: 'The child chosen before' }, ...students];

  const send = handleSubmit(async (values) => {
    setFormError(null);
    const fields: Record<string, string> = {
      ...draft.fields,
      studentId: values.studentId,
      occurredOn: values.occurredOn,
      problem: values.problem.trim(),
      answer: values.answer.trim(),
      explanation: values.explanation,
      note: values.note.trim(),
    };
    if (hasLines) {
      const lines = values.lines
        .split('\n')
        .map((l) => l.trim())
        .filter((l) => l !== '');
      if (lines.length > 0) fields.lines = JSON.stringify(lines);
      else delete fields.lines;
    }
    const student = options.find((s) => String(s.id) === values.studentId)?.name ?? 'A student';
    try {
      await replaceDraft(draft.key, {
        ...draft,
        key: errors.has('idempotency-key') ? newDraftKey() : draft.key,
        fields,
        photos,
        title: fields.problem ?? draft.title,
        detail: `${student} · ${dayWords(values.occurredOn)}`,
        refusal: null,
        refusalFields: {},
      });
      onClose();
    } catch {
      setFormError('The corrected miss could not be kept on this phone. Try again.');
    }
  });

  return (
    <Dialog isOpen onClose={onClose} title="Put the waiting miss right" className="wb-draft-dialog">
      <DialogForm
        label="Put the waiting miss right"
        onSubmit={(event) => void send(event)}
        error={error}
        onCancel={onClose}
        submitText="Send again"
        submitting={isSubmitting}
      >
        <p className="wb-draft-refusal" role="alert">
          Not accepted: {draft.refusal}
          {elsewhere.map(([name, message]) => (
            <span key={name} className="wb-draft-elsewhere">
              {' '}
              About {FIELD_WORDS[name] ?? name}: {message}
            </span>
          ))}
        </p>
        <SelectField
          idPrefix="draft"
          label="Student"
          control={control}
          name="studentId"
          rules={{ required: 'Choose the child who did this problem.' }}
          options={options.map((s) => ({ value: String(s.id), label: s.name }))}
        />
        <TextField
          idPrefix="draft"
          label="Date of the work"
          type="date"
          registration={register('occurredOn', missFieldRules.occurredOn)}
          error={shown.occurredOn?.message}
        />
        <TextField
          idPrefix="draft"
          label="The problem"
          autoComplete="off"
          registration={register('problem', missFieldRules.problem)}
          error={shown.problem?.message}
        />
        <TextField
          idPrefix="draft"
          label="The child’s answer"
          autoComplete="off"
          registration={register('answer', missFieldRules.answer)}
          error={shown.answer?.message}
        />
        {hasLines ? (
          <TextAreaField
            idPrefix="draft"
            label="Number sentences, one a line"
            registration={register('lines')}
            error={shown.lines?.message}
          />
        ) : null}
        <TextAreaField
          idPrefix="draft"
          label="What the child said"
          registration={register('explanation')}
          error={shown.explanation?.message}
        />
        <TextAreaField
          idPrefix="draft"
          label="Your note (optional)"
          rows={2}
          registration={register('note')}
          error={shown.note?.message}
        />
        {photos.length > 0 ? (
          <ul className="wb-draft-photos" aria-label="Photos of the waiting miss">
            {photos.map((photo, i) => (
              <li key={i}>
                <span>Photo {i + 1}</span>
                <Button
                  size="small"
                  variant="minimal"
                  icon={<CrossIcon />}
                  aria-label={`Leave photo ${i + 1} out`}
                  onClick={() => setPhotos((list) => list.filter((_, j) => j !== i))}
                />
              </li>
            ))}
          </ul>
        ) : null}
      </DialogForm>
    </Dialog>
  );
}
