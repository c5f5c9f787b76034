import { Button, Intent } from '@blueprintjs/core';
import { CommentIcon } from '@blueprintjs/icons';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { TextAreaField } from '../../../components/form/text-area-field';
import { useToast } from '../../../components/toaster';
import { useCreatePatternNote } from '../api/create-pattern-note';
import { shortDay, type PatternNote } from '../types';

function NoteForm({
  studentId,
  patternKey,
  label,
  onDone,
}: {
  studentId: number;
  patternKey: string;
  label: string;
  onDone: () => void;
}) {
  const toast = useToast();
  const create = useCreatePatternNote();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<{ body: string }>({ defaultValues: { body: '' } });

  const onSubmit = handleSubmit(async ({ body }) => {
    setFormError(null);
    try {
      await create.mutateAsync({ studentId, patternKey, body: body.trim() });
      toast('Note added.');
      onDone();
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, ['body']));
    }
  });

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={`Add a note on ${label}`}
      className="wb-note-form"
    >
      <FormError message={formError} />
      <TextAreaField
        idPrefix={`note-${patternKey}`}
        label="Your note"
        rows={3}
        placeholder="What you tried, what you noticed, what to try next."
        registration={register('body', {
          required: 'Write the note first.',
          validate: (value) => value.trim().length > 0 || 'Write the note first.',
          maxLength: { value: 2000, message: 'Keep it under 2,000 characters.' },
        })}
        error={errors.body?.message}
      />
      <div className="wb-note-actions">
        <Button variant="minimal" onClick={onDone}>
          Cancel
        </Button>
        <Button type="submit" intent={Intent.PRIMARY} loading={isSubmitting}>
          Save note
        </Button>
      </div>
    </form>
  );
}

/** The notes on one pattern, oldest first, and a way to add one (parents and tutors). */
export function PatternNotes({
  studentId,
  patternKey,
  label,
  notes,
}: {
  studentId: number;
  patternKey: string;
  label: string;
  notes: readonly PatternNote[];
}) {
  const [writing, setWriting] = useState(false);
  return (
    <div className="wb-pattern-notes">
      {notes.length > 0 ? (
        <ul className="wb-note-list" aria-label={`Notes on ${label}`}>
          {notes.map((note) => (
            <li key={note.id}>
              <p className="wb-note-body">{note.body}</p>
              <span className="wb-muted wb-note-meta">
                {note.author?.displayName ?? 'A former member'} ·{' '}
                {shortDay(note.createdAt.slice(0, 10))}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
      {writing ? (
        <NoteForm
          studentId={studentId}
          patternKey={patternKey}
          label={label}
          onDone={() => setWriting(false)}
        />
      ) : (
        <Button
          size="small"
          variant="minimal"
          icon={<CommentIcon />}
          onClick={() => setWriting(true)}
          aria-label={`Add a note on ${label}`}
        >
          Add a note
        </Button>
      )}
    </div>
  );
}
