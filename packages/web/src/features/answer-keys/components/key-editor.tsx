import { AnchorButton, Button, Card, Intent } from '@blueprintjs/core';
import { DownloadIcon, TrashIcon } from '@blueprintjs/icons';
import { useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';

import { ConfirmDeleteAlert } from '../../../components/confirm-delete-alert';
import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { TextField } from '../../../components/form/text-field';
import { ErrorState, LoadingState } from '../../../components/states';
import { useToast } from '../../../components/toaster';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { useDeleteAnswerKey } from '../api/delete-answer-key';
import { answerKeyCsvHref, useAnswerKey } from '../api/get-answer-key';
import { useUpdateAnswerKey } from '../api/update-answer-key';
import {
  KEY_KIND_LABEL,
  type AnswerKey,
  type CourseOption,
  type KeyItemInput,
  type RemarkedSitting,
} from '../types';
import { joinList, splitList } from '../utils/lists';
import { CorrectionsHistory } from './corrections-history';
import {
  KEY_FIELD_NAMES,
  KeyFields,
  keyFieldValues,
  toKeyFields,
  type KeyFieldValues,
} from './key-fields';
import { KeyItemsGrid, blankRow, type ItemRow, type ItemsValues } from './key-items-grid';
import { KeyItemsTable } from './key-items-table';
import { RemarkedCallout } from './remarked-callout';

const toRow = (item: AnswerKey['items'][number]): ItemRow => ({
  id: item.id,
  number: String(item.number),
  prompt: item.prompt,
  answer: item.answer,
  skills: joinList(item.skills),
  revisit: joinList(item.revisit),
  facts: joinList(item.facts),
});

const toItem = (row: ItemRow): KeyItemInput => ({
  ...(row.id !== undefined && { id: row.id }),
  number: Number(row.number),
  prompt: row.prompt.trim(),
  answer: row.answer.trim(),
  skills: splitList(row.skills),
  revisit: splitList(row.revisit),
  facts: splitList(row.facts),
});

type EditorProps = {
  answerKey: AnswerKey;
  courses: readonly CourseOption[];
  onSaved: (remarked: RemarkedSitting[]) => void;
};

function KeyEditForm({ answerKey, courses, onSaved }: EditorProps) {
  const toast = useToast();
  const update = useUpdateAnswerKey();
  const [formError, setFormError] = useState<string | null>(null);
  const details = useForm<KeyFieldValues>({ defaultValues: keyFieldValues(answerKey) });
  const items = useForm<ItemsValues>({
    defaultValues: {
      items: answerKey.items.length > 0 ? answerKey.items.map(toRow) : [blankRow(1)],
      reason: '',
    },
  });
  const hasSittings = answerKey.sittingCount > 0;
  const itemsChanged = items.formState.dirtyFields.items !== undefined;
  const saving = details.formState.isSubmitting || items.formState.isSubmitting;

  const save = details.handleSubmit((fieldValues) =>
    items.handleSubmit(async (itemValues) => {
      setFormError(null);
      try {
        const saved = await update.mutateAsync({
          id: answerKey.id,
          ...toKeyFields(fieldValues),
          items: itemValues.items.map(toItem),
          ...(itemValues.reason.trim() && { reason: itemValues.reason.trim() }),
        });
        toast(`Saved ${saved.title}.`);
        onSaved(saved.remarkedSittings);
      } catch (error) {
        const itemFields = isApiError(error)
          ? Object.keys(error.fields).filter(
              (name) => name.startsWith('items.') || name === 'reason',
            )
          : [];
        const detailMessage = applyFieldErrors(error, details.setError, KEY_FIELD_NAMES);
        const itemMessage = applyFieldErrors(
          error,
          items.setError,
          itemFields as Path<ItemsValues>[],
        );
        setFormError(itemFields.length > 0 ? itemMessage : detailMessage);
      }
    })(),
  );

  return (
    <form onSubmit={save} noValidate aria-label={`Edit ${answerKey.title}`}>
      <FormError message={formError} />
      <Card className="wb-panel">
        <h2 className="wb-subhead">About this key</h2>
        <KeyFields
          idPrefix="edit-key"
          courses={courses}
          register={details.register}
          control={details.control}
          errors={details.formState.errors}
        />
      </Card>
      <Card className="wb-panel">
        <h2 className="wb-subhead">Items</h2>
        <p className="wb-muted">
          Type each problem as printed and the key’s answer. The checker works out problems it can
          read and flags answers that disagree — it never changes what you typed.
        </p>
        <KeyItemsGrid
          control={items.control}
          register={items.register}
          errors={items.formState.errors}
          setFocus={items.setFocus}
        />
      </Card>
      {hasSittings && itemsChanged ? (
        <Card className="wb-panel">
          <TextField
            idPrefix="edit-key"
            label="Why did the key change?"
            help={`This key has ${answerKey.sittingCount} sitting${answerKey.sittingCount === 1 ? '' : 's'}. The reason is kept with the correction, and sittings marked against a changed answer are re-marked.`}
            registration={items.register('reason', {
              validate: (value) =>
                value.trim().length > 0 || 'Say why, e.g. “the printed key had a typo in item 4”.',
              maxLength: { value: 300, message: 'At most 300 characters.' },
            })}
            error={items.formState.errors.reason?.message}
          />
        </Card>
      ) : null}
      <div className="wb-save-bar">
        <Button type="submit" intent={Intent.PRIMARY} size="large" loading={saving}>
          Save the key
        </Button>
      </div>
    </form>
  );
}

/** One answer key: its items (editable for owners and parents), checker flags and history. */
export function KeyEditor({
  keyId,
  canEdit,
  courses,
  studentName,
}: {
  keyId: number;
  canEdit: boolean;
  courses: readonly CourseOption[];
  studentName: (id: number) => string;
}) {
  const answerKey = useAnswerKey(keyId);
  const navigate = useNavigate();
  const toast = useToast();
  const remove = useDeleteAnswerKey();
  const [remarked, setRemarked] = useState<RemarkedSitting[]>([]);
  const [deleting, setDeleting] = useState(false);
  // A fresh form after each save, so new items pick up the ids the API gave them.
  const [version, setVersion] = useState(0);

  if (answerKey.isPending) return <LoadingState label="Loading the answer key…" />;
  if (answerKey.isError) {
    return (
      <ErrorState
        title="This answer key could not be loaded."
        error={answerKey.error}
        onRetry={() => void answerKey.refetch()}
      />
    );
  }
  const key = answerKey.data;
  const course = courses.find((c) => c.id === key.courseId);

  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">{key.title}</h1>
          <p className="wb-muted">
            {[
              KEY_KIND_LABEL[key.kind],
              course?.name,
              key.lessonNumber ? `lesson ${key.lessonNumber}` : null,
              `${key.itemCount} items`,
              `${key.sittingCount} sitting${key.sittingCount === 1 ? '' : 's'}`,
            ]
              .filter(Boolean)
              .join(' · ')}
          </p>
        </div>
        <div className="wb-actions">
          <AnchorButton
            href={answerKeyCsvHref(key.id)}
            download
            icon={<DownloadIcon />}
            variant="outlined"
          >
            Export CSV
          </AnchorButton>
          {canEdit ? (
            <Button icon={<TrashIcon />} variant="minimal" onClick={() => setDeleting(true)}>
              Delete key
            </Button>
          ) : null}
        </div>
      </div>
      {remarked.length > 0 ? (
        <RemarkedCallout
          remarked={remarked}
          studentName={studentName}
          onDismiss={() => setRemarked([])}
        />
      ) : null}
      {canEdit ? (
        <KeyEditForm
          key={version}
          answerKey={key}
          courses={courses}
          onSaved={(changed) => {
            setRemarked(changed);
            setVersion((v) => v + 1);
          }}
        />
      ) : (
        <Card className="wb-panel">
          <h2 className="wb-subhead">Items</h2>
          <KeyItemsTable items={key.items} />
        </Card>
      )}
      <Card className="wb-panel">
        <h2 className="wb-subhead">Corrections</h2>
        <CorrectionsHistory corrections={key.corrections} />
      </Card>
      <ConfirmDeleteAlert
        isOpen={deleting}
        onClose={() => setDeleting(false)}
        onConfirm={() => remove.mutateAsync(key.id)}
        onDeleted={() => {
          toast(`Deleted ${key.title}.`);
          void navigate(paths.app.answerKeys.getHref());
        }}
      >
        <p>
          Delete <strong>{key.title}</strong> and its {key.itemCount} items? This cannot be undone.
        </p>
      </ConfirmDeleteAlert>
    </>
  );
}
