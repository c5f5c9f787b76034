import { Button, Callout, Dialog, DialogBody, DialogFooter, Intent } from '@blueprintjs/core';
import { TrashIcon } from '@blueprintjs/icons';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { TextField } from '../../../components/form/text-field';
import { useDeleteHousehold, type DeletionSummary } from '../api/delete-household';

function DeleteForm({
  householdName,
  onClose,
  onDeleted,
}: {
  householdName: string;
  onClose: () => void;
  onDeleted: (summary: DeletionSummary) => void;
}) {
  const remove = useDeleteHousehold();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<{ confirm: string }>({ defaultValues: { confirm: '' } });
  const typed = useWatch({ control, name: 'confirm' });
  const matches = typed.trim() === householdName.trim();

  const onSubmit = handleSubmit(async ({ confirm }) => {
    setFormError(null);
    try {
      onDeleted(await remove.mutateAsync(confirm.trim()));
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, ['confirm']));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Delete the household">
      <DialogBody>
        <FormError message={formError} />
        <p>
          This deletes <strong>everything in {householdName}</strong> for everyone in it: every
          student, miss, photo, explanation, note, sitting, answer key, course and review plan.
        </p>
        <ul className="wb-delete-list">
          <li>
            Members who belong to no other household lose their account too — including you, if this
            is your only household.
          </li>
          <li>It cannot be undone. Export first if you want to keep a copy.</li>
          <li>
            Some places ask homeschooling families to keep records for a time: check your local
            rules first. Workback does not claim to meet any of them for you.
          </li>
        </ul>
        <TextField
          idPrefix="delete-household"
          label={`Type the household’s name, “${householdName}”, to confirm`}
          autoComplete="off"
          registration={register('confirm', {
            required: 'Type the household’s name to confirm.',
            validate: (value) =>
              value.trim() === householdName.trim() ||
              `Type the name exactly as it is: “${householdName}”.`,
          })}
          error={errors.confirm?.message}
        />
      </DialogBody>
      <DialogFooter
        actions={
          <>
            <Button variant="minimal" onClick={onClose}>
              Keep everything
            </Button>
            <Button
              type="submit"
              intent={Intent.DANGER}
              icon={<TrashIcon />}
              disabled={!matches}
              loading={remove.isPending}
            >
              Delete the household
            </Button>
          </>
        }
      />
    </form>
  );
}

/** The owner's way out: delete the household and all of its data, after typing its name. */
export function DeleteHousehold({
  householdName,
  onDeleted,
}: {
  householdName: string;
  onDeleted: (summary: DeletionSummary) => void;
}) {
  const [open, setOpen] = useState(false);
  return (
    <section className="wb-data-section" aria-labelledby="data-delete">
      <h3 id="data-delete" className="wb-data-title">
        Delete the household
      </h3>
      <Callout className="wb-delete-callout">
        Removes {householdName} and everything in it, photos included, for everyone. You are asked
        to type its name first.
      </Callout>
      <Button
        icon={<TrashIcon />}
        variant="outlined"
        intent={Intent.DANGER}
        onClick={() => setOpen(true)}
      >
        Delete the household…
      </Button>
      <Dialog
        isOpen={open}
        onClose={() => setOpen(false)}
        title={`Delete ${householdName}?`}
        className="wb-dialog"
      >
        {open ? (
          <DeleteForm
            householdName={householdName}
            onClose={() => setOpen(false)}
            onDeleted={(summary) => {
              setOpen(false);
              onDeleted(summary);
            }}
          />
        ) : null}
      </Dialog>
    </section>
  );
}
