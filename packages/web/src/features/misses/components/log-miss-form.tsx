import { Button, Callout, Intent, ProgressBar } from '@blueprintjs/core';
import { RefreshIcon } from '@blueprintjs/icons';
import { Cause, type InterviewStage } from '@workback/core';
import { useEffect, useState } from 'react';
import { useController, useForm, useWatch } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { FormError } from '../../../components/form/form-error';
import { SelectField } from '../../../components/form/select-field';
import { TextAreaField } from '../../../components/form/text-area-field';
import { TextField } from '../../../components/form/text-field';
import { useToast } from '../../../components/toaster';
import { paths } from '../../../config/paths';
import { isApiError, type UploadProgress } from '../../../lib/api-client';
import { missFields, newRequestKey, useCreateMiss } from '../api/create-miss';
import { readPartials, useLiveDiagnosis, type LiveDiagnosis } from '../hooks/use-live-diagnosis';
import { useRememberedStudent } from '../hooks/use-remembered-student';
import { useWordSuggestion } from '../hooks/use-word-suggestion';
import { formatDay, today, type MissInput, type StudentOption } from '../types';
import { missFieldRules } from '../utils/miss-field-rules';
import { CausePicker } from './cause-picker';
import { ExplanationPrompts } from './explanation-prompts';
import { applyPhotoChange, checkPhotos, PhotoPicker } from './photo-picker';
import { CheckersCaution, WorkingTrace } from './working-trace/working-trace';
import { placeLineErrors, readLines, validateLines, WordProblemFields } from './word-problem';
import '../misses.css';

type Values = {
  studentId: string;
  occurredOn: string;
  problem: string;
  answer: string;
  partials: string;
  explanation: string;
  cause: Cause;
  note: string;
  lines: string;
  stage: InterviewStage | '';
};

const FIELDS = [
  'studentId',
  'occurredOn',
  'problem',
  'answer',
  'explanation',
  'cause',
  'note',
  'lines',
  'stage',
] as const;

/** Refusals about the photos themselves: too large, not an image, unreadable. */
const PHOTO_REFUSALS = [413, 415, 422];

// Keyed by text, so a kind the engine learns before this table does still reads (as "a problem").
const KIND_WORDS: Record<string, string> = {
  addition: 'addition',
  subtraction: 'subtraction',
  multiplication: 'multiplication',
  division: 'division',
  rounding: 'rounding',
  missing: 'a missing number',
  'fraction-sum': 'fractions',
  'fraction-comparison': 'comparing fractions',
  decimal: 'decimals',
  'decimal-comparison': 'comparing decimals',
  clock: 'telling the time',
};

function problemHelp(live: LiveDiagnosis) {
  if (!live.parsed) {
    return 'As written on the sheet, e.g. 304 - 75, 27 x 4, 612 ÷ 6, round 3456 to nearest hundred, 1/2 + 1/3.';
  }
  if (live.parsed.ok) {
    return (
      <>
        Read as <span className="wb-mono">{live.parsed.problem.text}</span> (
        {KIND_WORDS[live.parsed.problem.kind] ?? 'a problem'}).
      </>
    );
  }
  return `The checkers cannot read this: ${live.parsed.error.message} You can still save it and choose the cause yourself.`;
}

function answerHelp(live: LiveDiagnosis): string {
  if (live.result && !live.result.ok && live.result.part === 'answer') {
    return `The checkers cannot read this answer: ${live.result.error.message}`;
  }
  return 'Exactly as the child wrote it, e.g. 139, 7 R 3, 2/5 or <.';
}

function LivePanel({ live, hasAnswer }: { live: LiveDiagnosis; hasAnswer: boolean }) {
  let status: string;
  let body = null;
  if (!live.parsed || !live.parsed.ok) {
    status = 'The working appears here once the problem can be read.';
  } else if (!hasAnswer) {
    status = 'Type the child’s answer to see where it went differently.';
  } else if (live.failed) {
    status = 'The checkers cannot work this kind of problem yet. You can still save it.';
  } else if (!live.result || !live.result.ok) {
    status = 'The answer cannot be read yet.';
  } else {
    status = live.result.correct
      ? 'Checked: this answer is right.'
      : `Checked: the usual working gives ${live.result.expected}.`;
    body = <WorkingTrace diagnosis={live.result} />;
  }
  return (
    <section className="wb-live" aria-labelledby="live-title">
      <h2 id="live-title" className="wb-section-title">
        What the checkers see
      </h2>
      <p className="wb-muted" role="status" aria-live="polite">
        {status}
      </p>
      {body}
      {body ? null : <CheckersCaution />}
    </section>
  );
}

/** A miss that could not be sent (no connection), handed to whoever keeps it on the phone. */
export type OfflineMiss = {
  key: string;
  fields: Record<string, string>;
  photos: readonly File[];
  title: string;
  detail: string;
};

function percent(progress: UploadProgress | null): number | null {
  if (!progress || progress.total === 0) return null;
  return Math.min(1, progress.loaded / progress.total);
}

/** The Log-a-miss form: phone first, the diagnosis appearing as the parent types. */
export function LogMissForm({
  students,
  householdId,
  keepOffline,
}: {
  students: readonly StudentOption[];
  householdId: number;
  /** Keeps a miss on the phone when there is no connection; it is sent later with its key. */
  keepOffline?: (miss: OfflineMiss) => Promise<void>;
}) {
  const toast = useToast();
  const navigate = useNavigate();
  const create = useCreateMiss();
  const [remembered, remember] = useRememberedStudent(householdId);
  const initialStudent = students.some((s) => String(s.id) === remembered)
    ? remembered
    : students.length === 1
      ? String(students[0]?.id)
      : '';
  const [photos, setPhotos] = useState<File[]>([]);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [failedSave, setFailedSave] = useState<null | { another: boolean; message: string }>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [causeChosen, setCauseChosen] = useState(false);
  const [wordOpen, setWordOpen] = useState(false);
  // One key per miss being logged: a retry of the same miss (Try again, or the copy kept
  // offline) carries it, so the server makes one miss however often it arrives.
  const [requestKey, setRequestKey] = useState(newRequestKey);
  // Counts the misses logged here; each new round starts at the top, in the problem field.
  const [nextRound, setNextRound] = useState(0);

  const {
    register,
    control,
    handleSubmit,
    setError,
    setValue,
    reset,
    setFocus,
    formState: { errors, isSubmitting },
  } = useForm<Values>({
    defaultValues: {
      studentId: initialStudent,
      occurredOn: today(),
      problem: '',
      answer: '',
      partials: '',
      explanation: '',
      cause: Cause.unsure,
      note: '',
      lines: '',
      stage: '',
    },
  });
  const { field: causeField } = useController({ control, name: 'cause' });
  const { field: stageField } = useController({ control, name: 'stage' });

  const [problem, answer, partials, linesText] = useWatch({
    control,
    name: ['problem', 'answer', 'partials', 'lines'],
  });
  const live = useLiveDiagnosis(problem, answer, partials);
  const diagnosis = live.result?.ok ? live.result : null;
  // The stage chosen feeds the cause offered (reading → misread, work it → the working's).
  const suggestion = useWordSuggestion(
    diagnosis,
    wordOpen ? linesText : '',
    wordOpen ? stageField.value : '',
  );
  const showPartials =
    live.parsed?.ok === true &&
    live.parsed.problem.kind === 'multiplication' &&
    live.parsed.problem.factors[1].length > 1;

  useEffect(() => {
    if (nextRound === 0) return;
    window.scrollTo({ top: 0 });
    setFocus('problem');
  }, [nextRound, setFocus]);

  // Follow the checkers' suggestion until the parent picks a cause themselves.
  useEffect(() => {
    if (!causeChosen) setValue('cause', suggestion?.cause ?? Cause.unsure);
  }, [suggestion, causeChosen, setValue]);

  const save = async (values: Values, another: boolean) => {
    setFormError(null);
    setFailedSave(null);
    const tooMany = checkPhotos(photos);
    setPhotoError(tooMany);
    if (tooMany) return;
    const written = readPartials(values.partials);
    const input: MissInput = {
      studentId: Number(values.studentId),
      occurredOn: values.occurredOn,
      problem: values.problem.trim(),
      answer: values.answer.trim(),
      steps: showPartials && written ? { partials: written } : null,
      explanation: values.explanation,
      cause: values.cause,
      note: values.note.trim(),
      lines: wordOpen ? readLines(values.lines) : [],
      stage: wordOpen && values.stage ? values.stage : null,
    };
    remember(values.studentId);
    const key = requestKey;
    const startNext = () => {
      reset({
        studentId: values.studentId,
        occurredOn: values.occurredOn,
        problem: '',
        answer: '',
        partials: '',
        explanation: '',
        cause: Cause.unsure,
        note: '',
        lines: '',
        stage: '',
      });
      setCauseChosen(false);
      setWordOpen(false);
      setPhotos([]);
      setRequestKey(newRequestKey());
      setNextRound((n) => n + 1);
    };
    const keep = async () => {
      if (!keepOffline) return false;
      const student = students.find((s) => String(s.id) === values.studentId)?.name ?? 'A student';
      await keepOffline({
        key,
        fields: missFields(input),
        photos,
        title: input.problem,
        detail: `${student} · ${formatDay(input.occurredOn)}`,
      });
      toast(
        'No connection: the miss is kept on this phone and is sent when the connection returns.',
        Intent.PRIMARY,
      );
      startNext();
      return true;
    };
    if (typeof navigator !== 'undefined' && !navigator.onLine && (await keep())) return;
    setProgress(photos.length > 0 ? { loaded: 0, total: 1 } : null);
    try {
      const miss = await create.mutateAsync({
        input,
        photos,
        key,
        onProgress: photos.length > 0 ? setProgress : undefined,
      });
      setProgress(null);
      if (another) {
        toast('Saved. Ready for the next one.');
        startNext();
      } else {
        toast('Saved the miss.');
        void navigate(paths.app.miss.getHref(miss.id));
      }
    } catch (error) {
      setProgress(null);
      // The connection dropped on the way: keep it on the phone, sent later with the same key.
      if (isApiError(error, 0) && (await keep().catch(() => false))) return;
      // A server hiccup: everything stays as typed, try again in one tap.
      if (!isApiError(error) || error.status === 0 || error.status >= 500) {
        setFailedSave({
          another,
          message: isApiError(error) ? error.message : 'Something went wrong while saving.',
        });
        return;
      }
      const photoProblem =
        error.fields.photos ?? (PHOTO_REFUSALS.includes(error.status) ? error.message : null);
      setPhotoError(photoProblem);
      const others = Object.keys(error.fields).filter((f) => f !== 'photos');
      if (photoProblem && others.length === 0) return;
      setFormError(applyFieldErrors(placeLineErrors(error), setError, FIELDS));
    }
  };

  const onSave = handleSubmit((values) => save(values, false));
  const onSaveAnother = handleSubmit((values) => save(values, true));
  const shown = percent(progress);

  return (
    <form
      className="wb-log-form"
      noValidate
      aria-label="Log a miss"
      onSubmit={(event) => void onSave(event)}
    >
      <FormError message={formError} />
      {failedSave ? (
        <Callout intent={Intent.WARNING} className="wb-form-error" role="alert">
          <p>
            The miss was not saved: {failedSave.message} Everything you typed and the photos are
            still here.
          </p>
          <Button
            icon={<RefreshIcon />}
            intent={Intent.PRIMARY}
            onClick={() => void (failedSave.another ? onSaveAnother() : onSave())}
          >
            Try again
          </Button>
        </Callout>
      ) : null}
      <PhotoPicker
        files={photos}
        onChange={(change) => {
          setPhotos((list) => {
            const next = applyPhotoChange(list, change);
            setPhotoError(checkPhotos(next));
            return next;
          });
          setFailedSave(null);
          // Photo first, then type: the problem field is next.
          if (change.kind === 'add') setFocus('problem');
        }}
        error={photoError}
        disabled={isSubmitting}
      />
      <div className="wb-form-row">
        <SelectField
          idPrefix="miss"
          label="Student"
          control={control}
          name="studentId"
          rules={{ required: 'Choose the child who did this problem.' }}
          options={[
            { value: '', label: 'Choose a student' },
            ...students.map((s) => ({ value: String(s.id), label: s.name })),
          ]}
        />
        <TextField
          idPrefix="miss"
          label="Date of the work"
          type="date"
          registration={register('occurredOn', missFieldRules.occurredOn)}
          error={errors.occurredOn?.message}
        />
      </div>
      <TextField
        idPrefix="miss"
        label="The problem"
        autoComplete="off"
        registration={register('problem', missFieldRules.problem)}
        error={errors.problem?.message}
        help={<span aria-live="polite">{problemHelp(live)}</span>}
      />
      <TextField
        idPrefix="miss"
        label="The child’s answer"
        autoComplete="off"
        registration={register('answer', missFieldRules.answer)}
        error={errors.answer?.message}
        help={answerHelp(live)}
      />
      {showPartials ? (
        <TextField
          idPrefix="miss"
          label="Partial products the child wrote (optional)"
          autoComplete="off"
          inputMode="numeric"
          registration={register('partials')}
          help="Top row first, with any zeros they wrote, separated by commas: 68, 340."
        />
      ) : null}
      <LivePanel live={live} hasAnswer={answer.trim().length > 0} />
      <WordProblemFields
        open={wordOpen}
        onOpen={setWordOpen}
        registration={register('lines', { validate: validateLines })}
        error={errors.lines?.message ?? errors.stage?.message}
        stage={stageField.value}
        onStageChange={stageField.onChange}
        disabled={isSubmitting}
      />
      <ExplanationPrompts />
      <TextAreaField
        idPrefix="miss"
        label="What the child said"
        help="Their own words, as close as you can. Leave it empty if you have not asked yet."
        registration={register('explanation', {
          maxLength: { value: 2000, message: 'Keep it under 2000 characters.' },
        })}
        error={errors.explanation?.message}
      />
      <CausePicker
        value={causeField.value}
        onChange={(cause) => {
          setCauseChosen(true);
          causeField.onChange(cause);
        }}
        suggestion={suggestion}
        disabled={isSubmitting}
      />
      <TextAreaField
        idPrefix="miss"
        label="Your note (optional)"
        rows={2}
        registration={register('note', {
          maxLength: { value: 2000, message: 'Keep it under 2000 characters.' },
        })}
        error={errors.note?.message}
      />
      {progress ? (
        <div className="wb-upload" role="status" aria-live="polite">
          <span>
            {shown === null || shown < 1
              ? `Sending the photos… ${shown === null ? '' : `${Math.round(shown * 100)}%`}`
              : 'Photos sent. Saving…'}
          </span>
          <ProgressBar
            intent={Intent.PRIMARY}
            value={shown ?? undefined}
            aria-label="Upload progress"
          />
        </div>
      ) : null}
      <div className="wb-form-actions wb-sticky-actions">
        <Button type="submit" intent={Intent.PRIMARY} size="large" loading={isSubmitting}>
          Save
        </Button>
        <Button
          size="large"
          variant="outlined"
          disabled={isSubmitting}
          onClick={() => void onSaveAnother()}
        >
          Save and log another
        </Button>
      </div>
    </form>
  );
}
