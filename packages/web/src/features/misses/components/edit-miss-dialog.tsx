import { Dialog } from '@blueprintjs/core';
import { Cause, type InterviewStage } from '@workback/core';
import { useEffect, useState } from 'react';
import { useController, useForm, useWatch } from 'react-hook-form';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { DialogForm } from '../../../components/form/dialog-form';
import { TextAreaField } from '../../../components/form/text-area-field';
import { TextField } from '../../../components/form/text-field';
import { useToast } from '../../../components/toaster';
import { useUpdateMiss } from '../api/update-miss';
import { useLiveDiagnosis } from '../hooks/use-live-diagnosis';
import { useWordSuggestion } from '../hooks/use-word-suggestion';
import { type Miss, type MissChanges } from '../types';
import { missFieldRules } from '../utils/miss-field-rules';
import { CausePicker } from './cause-picker';
import { placeLineErrors, readLines, validateLines, WordProblemFields } from './word-problem';

type Values = Required<
  Pick<MissChanges, 'occurredOn' | 'problem' | 'answer' | 'explanation' | 'cause' | 'note'>
> & { lines: string; stage: InterviewStage | '' };

const FIELDS = [
  'occurredOn',
  'problem',
  'answer',
  'explanation',
  'cause',
  'note',
  'lines',
  'stage',
] as const;

const sameLines = (a: readonly string[], b: readonly string[]) =>
  a.length === b.length && a.every((line, i) => line === b[i]);

function EditMissForm({ miss, onClose }: { miss: Miss; onClose: () => void }) {
  const toast = useToast();
  const update = useUpdateMiss();
  const [formError, setFormError] = useState<string | null>(null);
  const savedLines = miss.lines ?? [];
  const [wordOpen, setWordOpen] = useState(savedLines.length > 0 || Boolean(miss.stage));
  // Once the stage is changed here, the cause follows what it suggests, unless the parent chose
  // the cause by hand: here, or before (a saved cause other than "not sure" or the suggestion).
  const [causeChosen, setCauseChosen] = useState(
    miss.cause !== Cause.unsure && miss.cause !== miss.suggestedCause,
  );
  const [follow, setFollow] = useState(false);
  const {
    register,
    control,
    handleSubmit,
    setError,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<Values>({
    defaultValues: {
      occurredOn: miss.occurredOn,
      problem: miss.problem,
      answer: miss.answer,
      explanation: miss.explanation,
      cause: miss.cause,
      note: miss.note,
      lines: savedLines.join('\n'),
      stage: miss.stage ?? '',
    },
  });
  const { field: cause } = useController({ control, name: 'cause' });
  const { field: stage } = useController({ control, name: 'stage' });
  const [problem, answer, linesText] = useWatch({
    control,
    name: ['problem', 'answer', 'lines'],
  });
  const live = useLiveDiagnosis(problem, answer);
  const suggestion = useWordSuggestion(
    live.result?.ok ? live.result : null,
    wordOpen ? linesText : '',
    wordOpen ? stage.value : '',
  );
  useEffect(() => {
    if (follow && !causeChosen) setValue('cause', suggestion?.cause ?? Cause.unsure);
  }, [suggestion, follow, causeChosen, setValue]);

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const { lines: text, stage: chosenStage, ...fields } = values;
    const lines = wordOpen ? readLines(text) : [];
    const newStage = wordOpen && chosenStage ? chosenStage : null;
    try {
      await update.mutateAsync({
        id: miss.id,
        ...fields,
        problem: values.problem.trim(),
        answer: values.answer.trim(),
        note: values.note.trim(),
        // Sent only when changed: a change runs the line checks again, as saving does.
        ...(sameLines(lines, savedLines) ? {} : { lines }),
        ...(newStage === (miss.stage ?? null) ? {} : { stage: newStage }),
      });
      toast('Saved the changes.');
      onClose();
    } catch (error) {
      setFormError(applyFieldErrors(placeLineErrors(error), setError, FIELDS));
    }
  });

  return (
    <DialogForm
      label="Edit the miss"
      onSubmit={onSubmit}
      error={formError}
      onCancel={onClose}
      submitText="Save changes"
      submitting={isSubmitting}
    >
      <TextField
        idPrefix="edit"
        label="Date of the work"
        type="date"
        registration={register('occurredOn', missFieldRules.occurredOn)}
        error={errors.occurredOn?.message}
      />
      <TextField
        idPrefix="edit"
        label="The problem"
        autoComplete="off"
        help="Changing the problem or the answer runs the checkers again."
        registration={register('problem', missFieldRules.problem)}
        error={errors.problem?.message}
      />
      <TextField
        idPrefix="edit"
        label="The child’s answer"
        autoComplete="off"
        registration={register('answer', missFieldRules.answer)}
        error={errors.answer?.message}
      />
      <TextAreaField
        idPrefix="edit"
        label="What the child said"
        registration={register('explanation', {
          maxLength: { value: 2000, message: 'Keep it under 2000 characters.' },
        })}
        error={errors.explanation?.message}
      />
      <WordProblemFields
        idPrefix="edit"
        open={wordOpen}
        onOpen={setWordOpen}
        registration={register('lines', { validate: validateLines })}
        error={errors.lines?.message ?? errors.stage?.message}
        stage={stage.value}
        onStageChange={(value) => {
          setFollow(true);
          stage.onChange(value);
        }}
        disabled={isSubmitting}
      />
      <CausePicker
        name="edit-cause"
        value={cause.value}
        onChange={(value) => {
          setCauseChosen(true);
          cause.onChange(value);
        }}
        suggestion={suggestion}
      />
      <TextAreaField
        idPrefix="edit"
        label="Your note"
        rows={2}
        registration={register('note', {
          maxLength: { value: 2000, message: 'Keep it under 2000 characters.' },
        })}
        error={errors.note?.message}
      />
    </DialogForm>
  );
}

/** Change what was logged; the form is fresh each time it opens. */
export function EditMissDialog({
  miss,
  open,
  onClose,
}: {
  miss: Miss;
  open: boolean;
  onClose: () => void;
}) {
  return (
    <Dialog
      isOpen={open}
      onClose={onClose}
      title="Edit the miss"
      className="wb-dialog wb-dialog-wide"
    >
      {open ? <EditMissForm miss={miss} onClose={onClose} /> : null}
    </Dialog>
  );
}
