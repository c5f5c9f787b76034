import { Button, Intent } from '@blueprintjs/core';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { TextAreaField } from '../../../components/form/text-area-field';
import { ErrorState, LoadingState } from '../../../components/states';
import { useCreateNote } from '../api/create-note';
import { useNotes } from '../api/get-notes';

function when(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  return date.toLocaleString(undefined, {
    day: 'numeric',
    month: 'short',
    hour: 'numeric',
    minute: '2-digit',
  });
}

/** The conversation about one miss: parents and tutors alike add to it. */
export function NotesThread({ missId }: { missId: number }) {
  const notes = useNotes(missId);
  const create = useCreateNote();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<{ body: string }>({ defaultValues: { body: '' } });

  const onSubmit = handleSubmit(async ({ body }) => {
    setFormError(null);
    try {
      await create.mutateAsync({ missId, body: body.trim() });
      reset({ body: '' });
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, ['body']));
    }
  });

  let list;
  if (notes.isPending) list = <LoadingState label="Loading notes…" />;
  else if (notes.isError)
    list = (
      <ErrorState
        title="The notes could not be loaded."
        error={notes.error}
        onRetry={() => void notes.refetch()}
      />
    );
  else if (notes.data.items.length === 0)
    list = <p className="wb-muted">No notes yet. Write the first one below.</p>;
  else
    list = (
      <ol className="wb-notes" aria-label="Notes">
        {notes.data.items.map((note) => (
          <li key={note.id} className="wb-note">
            <p className="wb-note-meta">
              <strong>{note.author?.displayName ?? 'Someone who has left'}</strong>{' '}
              <span className="wb-muted">{when(note.createdAt)}</span>
            </p>
            <p className="wb-note-body">{note.body}</p>
          </li>
        ))}
      </ol>
    );

  return (
    <div className="wb-notes-thread">
      {list}
      <form onSubmit={(event) => void onSubmit(event)} noValidate aria-label="New note">
        <FormError message={formError} />
        <TextAreaField
          idPrefix={`note-${missId}`}
          label="Add a note"
          rows={3}
          help="Seen by everyone who helps with this child."
          registration={register('body', {
            validate: (value) => value.trim().length > 0 || 'Write something first.',
            maxLength: { value: 2000, message: 'Keep it under 2000 characters.' },
          })}
          error={errors.body?.message}
        />
        <Button type="submit" intent={Intent.PRIMARY} loading={isSubmitting}>
          Add note
        </Button>
      </form>
    </div>
  );
}
