import { Dialog, DialogBody } from '@blueprintjs/core';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { CheckboxGroupField } from '../../../components/form/checkbox-group-field';
import { DialogForm } from '../../../components/form/dialog-form';
import { TextAreaField } from '../../../components/form/text-area-field';
import { ErrorState, LoadingState } from '../../../components/states';
import { useToast } from '../../../components/toaster';
import { ROLE_LABEL } from '../../../lib/auth';
import { useRecipients } from '../api/get-recipients';
import { useSendReviewPlan } from '../api/send-review-plan';

type SendValues = { memberIds: number[]; message: string };

function names(list: readonly string[]): string {
  if (list.length <= 1) return list[0] ?? 'nobody';
  return `${list.slice(0, -1).join(', ')} and ${list[list.length - 1]}`;
}

function SendForm({ planId, onClose }: { planId: number; onClose: () => void }) {
  const recipients = useRecipients(true);
  const send = useSendReviewPlan();
  const toast = useToast();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    control,
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SendValues>({ defaultValues: { memberIds: [], message: '' } });

  if (recipients.isPending)
    return (
      <DialogBody>
        <LoadingState label="Loading the members…" />
      </DialogBody>
    );
  if (recipients.isError) {
    return (
      <DialogBody>
        <ErrorState
          title="The members could not be loaded."
          error={recipients.error}
          onRetry={() => void recipients.refetch()}
        />
      </DialogBody>
    );
  }

  const onSubmit = handleSubmit(async ({ memberIds, message }) => {
    setFormError(null);
    try {
      const result = await send.mutateAsync({
        planId,
        memberIds,
        ...(message.trim() ? { message: message.trim() } : {}),
      });
      toast(`The plan is on its way to ${names(result.sent.map((s) => s.displayName))}.`);
      onClose();
    } catch (error) {
      setFormError(applyFieldErrors(error, setError, ['memberIds', 'message']));
    }
  });

  return (
    <DialogForm
      label="Send the plan by e-mail"
      onSubmit={onSubmit}
      error={formError}
      onCancel={onClose}
      submitText="Send"
      submitting={isSubmitting}
    >
      <CheckboxGroupField
        idPrefix="send"
        label="Send the PDF to"
        options={recipients.data.items.map((m) => ({
          value: m.id,
          label: `${m.displayName}${m.isYou ? ' (you)' : ''} · ${ROLE_LABEL[m.role]} · ${m.email}`,
        }))}
        control={control}
        name="memberIds"
        rules={{ validate: (ids: number[]) => ids.length > 0 || 'Tick at least one person.' }}
      />
      <TextAreaField
        idPrefix="send"
        label="A line to go with it (optional)"
        rows={2}
        placeholder="For Thursday morning, after breakfast."
        registration={register('message', {
          maxLength: { value: 500, message: 'Keep it under 500 characters.' },
        })}
        error={errors.message?.message}
      />
      <p className="wb-muted">
        The e-mail holds the child’s work: send it only to people who help with it.
      </p>
    </DialogForm>
  );
}

/** Choose members of the household to e-mail the plan's PDF to. */
export function SendPlanDialog({
  planId,
  open,
  onClose,
}: {
  planId: number;
  open: boolean;
  onClose: () => void;
}) {
  return (
    <Dialog isOpen={open} onClose={onClose} title="Send by e-mail" className="wb-dialog">
      {open ? <SendForm planId={planId} onClose={onClose} /> : null}
    </Dialog>
  );
}
