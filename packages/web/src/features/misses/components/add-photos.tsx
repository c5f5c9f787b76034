import { Button, Intent, ProgressBar } from '@blueprintjs/core';
import { useState } from 'react';

import { useToast } from '../../../components/toaster';
import { isApiError, type UploadProgress } from '../../../lib/api-client';
import { useAddPhotos } from '../api/add-photos';
import { applyPhotoChange, checkPhotos, MAX_PHOTOS, PhotoPicker } from './photo-picker';

/** More photos for a saved miss: chosen, prepared and cropped as when logging, then sent. */
export function AddPhotos({ missId, have }: { missId: number; have: number }) {
  const toast = useToast();
  const add = useAddPhotos();
  const [photos, setPhotos] = useState<File[]>([]);
  const [error, setError] = useState<string | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const room = MAX_PHOTOS - have;
  if (room <= 0) return <p className="wb-muted">This miss holds its {MAX_PHOTOS} photos.</p>;

  const send = () => {
    const problem = checkPhotos(photos, room);
    setError(problem);
    if (problem || photos.length === 0) return;
    setProgress({ loaded: 0, total: 1 });
    add.mutate(
      { missId, photos, onProgress: setProgress },
      {
        onSuccess: () => {
          toast(photos.length === 1 ? 'Added the photo.' : `Added ${photos.length} photos.`);
          setPhotos([]);
        },
        onError: (e) =>
          setError(
            isApiError(e) ? (e.fields.photos ?? e.message) : 'The photos could not be added.',
          ),
        onSettled: () => setProgress(null),
      },
    );
  };
  const shown = progress && progress.total > 0 ? progress.loaded / progress.total : null;

  return (
    <div className="wb-add-photos">
      <PhotoPicker
        label="Add photos"
        files={photos}
        max={room}
        onChange={(change) => {
          setPhotos((list) => applyPhotoChange(list, change));
          setError(null);
        }}
        error={error}
        disabled={add.isPending}
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
      {photos.length > 0 ? (
        <Button intent={Intent.PRIMARY} loading={add.isPending} onClick={send}>
          {photos.length === 1 ? 'Add this photo' : `Add these ${photos.length} photos`}
        </Button>
      ) : null}
    </div>
  );
}
