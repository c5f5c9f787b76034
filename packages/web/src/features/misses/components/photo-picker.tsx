import { Button, FormGroup, Intent } from '@blueprintjs/core';
import { CameraIcon, CrossIcon, MediaIcon } from '@blueprintjs/icons';
import { useEffect, useId, useMemo, useRef } from 'react';

export const MAX_PHOTOS = 4;
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;

/** `checkPhotos(files)` → a message for the parent, or `null` when the photos can be sent. */
export function checkPhotos(files: readonly File[]): string | null {
  if (files.length > MAX_PHOTOS) return `Attach at most ${MAX_PHOTOS} photos to one miss.`;
  const big = files.find((f) => f.size > MAX_PHOTO_BYTES);
  if (big) return `${big.name} is over 10 MiB. Take the photo again a little further away.`;
  return null;
}

function usePreviews(files: readonly File[]): string[] {
  const urls = useMemo(() => files.map((f) => URL.createObjectURL(f)), [files]);
  useEffect(() => () => urls.forEach((u) => URL.revokeObjectURL(u)), [urls]);
  return urls;
}

/**
 * Photos of the missed work: straight from the phone's camera or from files, with previews.
 * Location and camera details are removed on the server before anything is stored.
 */
export function PhotoPicker({
  files,
  onChange,
  error,
  disabled,
}: {
  files: readonly File[];
  onChange: (files: File[]) => void;
  error?: string | null;
  disabled?: boolean;
}) {
  const cameraRef = useRef<HTMLInputElement>(null);
  const filesRef = useRef<HTMLInputElement>(null);
  const previews = usePreviews(files);
  const id = useId();
  const full = files.length >= MAX_PHOTOS;

  const add = (list: FileList | null) => {
    if (!list || list.length === 0) return;
    onChange([...files, ...Array.from(list)]);
  };

  return (
    <FormGroup
      label="Photos of the work"
      labelFor={`${id}-files`}
      intent={error ? Intent.DANGER : Intent.NONE}
      helperText={
        <span id={`${id}-help`}>
          {error ??
            `Up to ${MAX_PHOTOS} photos, 10 MiB each. Location and camera details are removed before they are kept.`}
        </span>
      }
    >
      <div className="wb-photo-actions">
        <Button
          icon={<CameraIcon />}
          size="large"
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
      {files.length > 0 ? (
        <ul className="wb-photo-previews" aria-label="Photos to send">
          {files.map((file, i) => (
            <li key={`${file.name}-${i}`} className="wb-photo-preview">
              <img src={previews[i]} alt={`Photo ${i + 1} to send`} />
              <Button
                className="wb-photo-remove"
                icon={<CrossIcon />}
                size="small"
                aria-label={`Remove photo ${i + 1}`}
                disabled={disabled}
                onClick={() => onChange(files.filter((_, j) => j !== i))}
              />
            </li>
          ))}
        </ul>
      ) : null}
    </FormGroup>
  );
}
