import { Button, FormGroup, Intent, Spinner } from '@blueprintjs/core';
import { CameraIcon, CropIcon, CrossIcon, MediaIcon } from '@blueprintjs/icons';
import { lazy, Suspense, useEffect, useId, useMemo, useRef, useState } from 'react';

import { preparePhotos } from '../utils/prepare-photo';

// The cropper (react-easy-crop) loads when a photo is first cropped, not with the form.
const CropDialog = lazy(() => import('./crop-dialog').then((m) => ({ default: m.CropDialog })));

export const MAX_PHOTOS = 4;
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;

/** `checkPhotos(files)` → a message for the parent, or `null` when the photos can be sent. */
export function checkPhotos(files: readonly File[], max = MAX_PHOTOS): string | null {
  if (files.length > max) {
    return max === MAX_PHOTOS
      ? `Attach at most ${MAX_PHOTOS} photos to one miss.`
      : `This miss has room for ${max} more ${max === 1 ? 'photo' : 'photos'}.`;
  }
  const big = files.find((f) => f.size > MAX_PHOTO_BYTES);
  if (big) return `${big.name} is over 10 MiB. Take the photo again a little further away.`;
  return null;
}

function usePreviews(files: readonly File[]): string[] {
  const urls = useMemo(() => files.map((f) => URL.createObjectURL(f)), [files]);
  useEffect(() => () => urls.forEach((u) => URL.revokeObjectURL(u)), [urls]);
  return urls;
}

/** Changes to the chosen photos, applied by the form to its latest list. */
export type PhotoChange =
  | { kind: 'add'; files: File[] }
  | { kind: 'remove'; index: number }
  | { kind: 'replace'; index: number; file: File };

export function applyPhotoChange(files: readonly File[], change: PhotoChange): File[] {
  switch (change.kind) {
    case 'add':
      return [...files, ...change.files];
    case 'remove':
      return files.filter((_, i) => i !== change.index);
    case 'replace':
      return files.map((f, i) => (i === change.index ? change.file : f));
  }
}

/**
 * Photos of the missed work: straight from the phone's camera or from files. Each is prepared on
 * the phone (upright, at most 2048 px, no location or camera details) as soon as it is chosen,
 * can be cropped and turned, and shows as a preview.
 */
export function PhotoPicker({
  files,
  onChange,
  error,
  disabled,
  max = MAX_PHOTOS,
  label = 'Photos of the work',
}: {
  files: readonly File[];
  onChange: (change: PhotoChange) => void;
  error?: string | null;
  disabled?: boolean;
  max?: number;
  label?: string;
}) {
  const cameraRef = useRef<HTMLInputElement>(null);
  const filesRef = useRef<HTMLInputElement>(null);
  const previews = usePreviews(files);
  const id = useId();
  const [preparing, setPreparing] = useState(0);
  const [cropping, setCropping] = useState<number | null>(null);
  const full = files.length + preparing >= max;

  const add = (list: FileList | null) => {
    if (!list || list.length === 0) return;
    const chosen = Array.from(list);
    setPreparing((n) => n + chosen.length);
    void preparePhotos(chosen)
      .then((prepared) => onChange({ kind: 'add', files: prepared }))
      .finally(() => setPreparing((n) => n - chosen.length));
  };

  return (
    <FormGroup
      label={label}
      labelFor={`${id}-files`}
      intent={error ? Intent.DANGER : Intent.NONE}
      helperText={
        <span id={`${id}-help`}>
          {error ??
            `Up to ${max} ${max === 1 ? 'photo' : 'photos'}. Made smaller on this phone before sending; location and camera details are removed.`}
        </span>
      }
    >
      <div className="wb-photo-actions">
        <Button
          icon={<CameraIcon />}
          size="large"
          intent={files.length === 0 ? Intent.PRIMARY : Intent.NONE}
          disabled={disabled || full}
          onClick={() => cameraRef.current?.click()}
        >
          Take a photo
        </Button>
        <Button
          icon={<MediaIcon />}
          size="large"
          variant="outlined"
          disabled={disabled || full}
          onClick={() => filesRef.current?.click()}
        >
          Choose files
        </Button>
      </div>
      <input
        ref={cameraRef}
        className="wb-file-input"
        type="file"
        accept="image/*"
        capture="environment"
        tabIndex={-1}
        aria-hidden="true"
        onChange={(event) => {
          add(event.currentTarget.files);
          event.currentTarget.value = '';
        }}
      />
      <input
        ref={filesRef}
        id={`${id}-files`}
        className="wb-file-input"
        type="file"
        accept="image/*"
        multiple
        tabIndex={-1}
        aria-describedby={`${id}-help`}
        aria-invalid={error ? true : undefined}
        onChange={(event) => {
          add(event.currentTarget.files);
          event.currentTarget.value = '';
        }}
      />
      {files.length > 0 || preparing > 0 ? (
        <ul className="wb-photo-previews" aria-label="Photos to send" aria-busy={preparing > 0}>
          {files.map((file, i) => (
            <li key={`${file.name}-${file.lastModified}-${i}`} className="wb-photo-preview">
              <img src={previews[i]} alt={`Photo ${i + 1} to send`} />
              <Button
                className="wb-photo-remove"
                icon={<CrossIcon />}
                size="small"
                aria-label={`Remove photo ${i + 1}`}
                disabled={disabled}
                onClick={() => onChange({ kind: 'remove', index: i })}
              />
              <Button
                className="wb-photo-crop"
                icon={<CropIcon />}
                size="small"
                aria-label={`Crop or turn photo ${i + 1}`}
                disabled={disabled}
                onClick={() => setCropping(i)}
              />
            </li>
          ))}
          {Array.from({ length: preparing }, (_, i) => (
            <li key={`preparing-${i}`} className="wb-photo-preview wb-photo-preparing">
              <Spinner size={24} aria-label="Preparing the photo" />
            </li>
          ))}
        </ul>
      ) : null}
      {preparing > 0 ? (
        <p className="wb-muted" role="status">
          Preparing {preparing === 1 ? 'the photo' : `${preparing} photos`}…
        </p>
      ) : null}
      {cropping !== null ? (
        <Suspense fallback={<Spinner size={24} aria-label="Opening the cropper" />}>
          <CropDialog
            file={files[cropping] ?? null}
            index={cropping}
            onClose={() => setCropping(null)}
            onDone={(file) => {
              onChange({ kind: 'replace', index: cropping, file });
              setCropping(null);
            }}
          />
        </Suspense>
      ) : null}
    </FormGroup>
  );
}
