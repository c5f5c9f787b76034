import { Dialog, FileInput, FormGroup, Intent } from '@blueprintjs/core';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';

import { applyFieldErrors } from '../../../components/form/apply-field-errors';
import { DialogForm } from '../../../components/form/dialog-form';
import { useToast } from '../../../components/toaster';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { useImportAnswerKey } from '../api/import-answer-key';
import type { CourseOption } from '../types';
import {
  MAX_CSV_BYTES,
  problemsFromFields,
  readKeyCsv,
  type CsvPreview,
  type CsvProblem,
} from '../utils/read-key-csv';
import { CsvPreviewTable } from './csv-preview-table';
import { CsvProblems } from './csv-problems';
import {
  emptyKeyFields,
  KEY_FIELD_NAMES,
  KeyFields,
  toKeyFields,
  type KeyFieldValues,
} from './key-fields';

type Chosen = { file: File; preview: CsvPreview } | { file: File; unreadable: string } | null;

/** `'worksheet-14_v2.csv'` → `'Worksheet 14 v2'`: a first guess at the title. */
function titleFromFileName(name: string): string {
  const base = name
    .replace(/\.[^.]+$/, '')
    .replace(/[-_]+/g, ' ')
    .trim();
  return base ? base[0]!.toUpperCase() + base.slice(1) : '';
}

function ImportKeyForm({
  courses,
  onClose,
}: {
  courses: readonly CourseOption[];
  onClose: () => void;
}) {
  const toast = useToast();
  const navigate = useNavigate();
  const upload = useImportAnswerKey();
  const [chosen, setChosen] = useState<Chosen>(null);
  const [serverProblems, setServerProblems] = useState<CsvProblem[]>([]);
  const [formError, setFormError] = useState<string | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    getValues,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<KeyFieldValues>({ defaultValues: emptyKeyFields });

  const choose = async (file: File | undefined) => {
    setServerProblems([]);
    setFormError(null);
    setFileError(null);
    if (!file) {
      setChosen(null);
      return;
    }
    if (file.size > MAX_CSV_BYTES) {
      setChosen({ file, unreadable: 'This file is over 2 MiB; a key’s CSV is much smaller.' });
      return;
    }
    if (!getValues('title')) setValue('title', titleFromFileName(file.name));
    try {
      setChosen({ file, preview: readKeyCsv(await file.text()) });
    } catch {
      setChosen({ file, unreadable: 'This file could not be read as text.' });
    }
  };

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setServerProblems([]);
    if (!chosen) {
      setFileError('Choose the CSV file first.');
      return;
    }
    try {
      const key = await upload.mutateAsync({ ...toKeyFields(values), file: chosen.file });
      toast(`Imported ${key.title}: ${key.itemCount} items.`);
      onClose();
      void navigate(paths.app.answerKey.getHref(key.id));
    } catch (error) {
      if (isApiError(error)) {
        const fileProblems = Object.fromEntries(
          Object.entries(error.fields).filter(
            ([name]) => name.startsWith('line ') || name === 'file',
          ),
        );
        if (Object.keys(fileProblems).length > 0) {
          setServerProblems(problemsFromFields(fileProblems));
          setFormError(
            Object.keys(fileProblems).length < Object.keys(error.fields).length
              ? applyFieldErrors(error, setError, KEY_FIELD_NAMES)
              : null,
          );
          return;
        }
      }
      setFormError(applyFieldErrors(error, setError, KEY_FIELD_NAMES));
    }
  });

  const preview = chosen && 'preview' in chosen ? chosen.preview : null;
  const localProblems = preview?.problems ?? [];
  const blocked = !chosen || 'unreadable' in chosen || localProblems.length > 0;

  return (
    <DialogForm
      label="Import a key from a CSV file"
      onSubmit={onSubmit}
      error={formError}
      onCancel={onClose}
      submitText={preview ? `Import ${preview.rows.length} items` : 'Import'}
      submitting={isSubmitting}
      submitDisabled={chosen !== null && blocked}
    >
      <p className="wb-muted wb-import-help">
        One item per line under the header <code>number,prompt,answer,skills,revisit,facts</code>;
        lists separated by <code>;</code>, lessons as <code>12; 31-33</code>. You see every row here
        before anything is saved.
      </p>
      <FormGroup
        label="CSV file"
        labelFor="import-file"
        intent={fileError ? Intent.DANGER : Intent.NONE}
        helperText={
          <span id="import-file-help">
            {fileError ?? 'Saved from a spreadsheet as “CSV UTF-8”, at most 2 MiB.'}
          </span>
        }
      >
        <FileInput
          fill
          size="large"
          text={chosen?.file.name ?? 'Choose a CSV file…'}
          buttonText="Browse"
          hasSelection={chosen !== null}
          inputProps={{
            id: 'import-file',
            accept: '.csv,text/csv',
            'aria-describedby': 'import-file-help',
          }}
          onInputChange={(event) => void choose(event.currentTarget.files?.[0])}
        />
      </FormGroup>
      <KeyFields
        idPrefix="import-key"
        courses={courses}
        register={register}
        control={control}
        errors={errors}
      />
      {chosen && 'unreadable' in chosen ? (
        <CsvProblems title="This file cannot be imported" hint={chosen.unreadable} problems={[]} />
      ) : null}
      {serverProblems.length > 0 ? (
        <CsvProblems
          title="Nothing was imported"
          hint="One bad row refuses the whole file. Fix these rows in the spreadsheet, save it as CSV again and choose it here:"
          problems={serverProblems}
        />
      ) : null}
      {localProblems.length > 0 ? (
        <CsvProblems
          title={`${new Set(localProblems.map((p) => p.line)).size} line(s) need fixing first`}
          hint="Fix these in the spreadsheet, save it as CSV again and choose it here:"
          problems={localProblems}
        />
      ) : null}
      {preview && preview.rows.length > 0 ? (
        <>
          <p className="wb-import-count" role="status">
            {preview.rows.length} item{preview.rows.length === 1 ? '' : 's'} read from{' '}
            {chosen?.file.name}.
          </p>
          <CsvPreviewTable rows={preview.rows} problems={localProblems} />
        </>
      ) : null}
    </DialogForm>
  );
}

/** Import a key from a CSV: preview in the browser first, then one upload. */
export function ImportKeyDialog({
  open,
  courses,
  onClose,
}: {
  open: boolean;
  courses: readonly CourseOption[];
  onClose: () => void;
}) {
  return (
    <Dialog
      isOpen={open}
      onClose={onClose}
      title="Import a key from a CSV file"
      className="wb-dialog wb-dialog-import"
    >
      {open ? <ImportKeyForm courses={courses} onClose={onClose} /> : null}
    </Dialog>
  );
}
