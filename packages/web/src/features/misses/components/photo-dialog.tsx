import {
  Alert,
  Button,
  Dialog,
  DialogBody,
  DialogFooter,
  InputGroup,
  Intent,
} from '@blueprintjs/core';
import { CrossIcon, MapMarkerIcon } from '@blueprintjs/icons';
import { useEffect, useState, type MouseEvent } from 'react';
import { useBlocker } from 'react-router-dom';

import { useToast } from '../../../components/toaster';
import { isApiError } from '../../../lib/api-client';
import { useSetPhotoMarks } from '../api/set-photo-marks';
import type { MissPhoto, PhotoMark } from '../types';

export const MAX_PINS = 20;

const round = (n: number) => Math.round(Math.min(1, Math.max(0, n)) * 1000) / 1000;

/** Where a click landed on the image, as fractions of its width and height. */
export function pinAt(event: MouseEvent<HTMLElement>): { x: number; y: number } {
  const rect = event.currentTarget.getBoundingClientRect();
  return {
    x: round((event.clientX - rect.left) / (rect.width || 1)),
    y: round((event.clientY - rect.top) / (rect.height || 1)),
  };
}

/**
 * While pins are placed but not saved: the browser asks before the page is closed or reloaded,
 * and a move to another page of the app waits for the parent's answer.
 */
function useUnsavedGuard(unsaved: boolean) {
  const blocker = useBlocker(unsaved);
  useEffect(() => {
    if (!unsaved) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [unsaved]);
  return blocker;
}

function LeavePinsAlert({
  open,
  onLeave,
  onStay,
}: {
  open: boolean;
  onLeave: () => void;
  onStay: () => void;
}) {
  return (
    <Alert
      isOpen={open}
      intent={Intent.DANGER}
      confirmButtonText="Leave without saving"
      cancelButtonText="Keep placing pins"
      onConfirm={onLeave}
      onCancel={onStay}
      canEscapeKeyCancel
    >
      <p>The pins on this photo are not saved yet. Leave them, or keep placing them and save?</p>
    </Alert>
  );
}

function PinEditor({
  missId,
  photo,
  index,
  onClose,
  onChangedChange,
}: {
  missId: number;
  photo: MissPhoto;
  index: number;
  onClose: () => void;
  /** Tells the dialog whether pins wait to be saved, so closing it can ask first. */
  onChangedChange: (changed: boolean) => void;
}) {
  const toast = useToast();
  const save = useSetPhotoMarks();
  const [pins, setPins] = useState<PhotoMark[]>(photo.marks);
  const [error, setError] = useState<string | null>(null);
  const changed = JSON.stringify(pins) !== JSON.stringify(photo.marks);
  const full = pins.length >= MAX_PINS;
  const blocker = useUnsavedGuard(changed);
  useEffect(() => onChangedChange(changed), [changed, onChangedChange]);

  const add = (point: { x: number; y: number }) => {
    if (full) return;
    setPins((list) => [...list, { ...point, label: null }]);
  };

  const onSave = () => {
    setError(null);
    save.mutate(
      { missId, photoId: photo.id, marks: pins },
      {
        onSuccess: (saved) => {
          setPins(saved.marks);
          toast(saved.marks.length === 1 ? 'Saved 1 pin.' : `Saved ${saved.marks.length} pins.`);
        },
        onError: (e) => setError(isApiError(e) ? e.message : 'The pins could not be saved.'),
      },
    );
  };

  return (
    <>
      <LeavePinsAlert
        open={blocker.state === 'blocked'}
        onLeave={() => blocker.proceed?.()}
        onStay={() => blocker.reset?.()}
      />
      <DialogBody className="wb-photo-dialog-body">
        <p className="wb-muted">
          Tap the photo to put a pin where something went differently. Give it a few words if you
          like.
        </p>
        <div className="wb-photo-stage">
          <button
            type="button"
            className="wb-photo-target"
            aria-label={`Photo ${index + 1}: tap to place a pin`}
            disabled={full}
            onClick={(event) => add(pinAt(event))}
          >
            <img src={photo.imageUrl} alt={`Photo ${index + 1} of the work, full size`} />
          </button>
          {pins.map((pin, i) => (
            <span
              key={i}
              className="wb-pin"
              style={{ left: `${pin.x * 100}%`, top: `${pin.y * 100}%` }}
              aria-hidden="true"
            >
              {i + 1}
            </span>
          ))}
        </div>
        {pins.length > 0 ? (
          <ol className="wb-pin-list" aria-label="Pins on this photo">
            {pins.map((pin, i) => (
              <li key={i}>
                <span className="wb-pin wb-pin-static" aria-hidden="true">
                  {i + 1}
                </span>
                <InputGroup
                  aria-label={`Words for pin ${i + 1}`}
                  placeholder="e.g. borrowed here"
                  maxLength={40}
                  value={pin.label ?? ''}
                  onValueChange={(value) =>
                    setPins((list) =>
                      list.map((p, j) => (j === i ? { ...p, label: value || null } : p)),
                    )
                  }
                />
                <Button
                  icon={<CrossIcon />}
                  variant="minimal"
                  aria-label={`Remove pin ${i + 1}`}
                  onClick={() => setPins((list) => list.filter((_, j) => j !== i))}
                />
              </li>
            ))}
          </ol>
        ) : (
          <p className="wb-muted">No pins on this photo yet.</p>
        )}
        {full ? <p className="wb-muted">A photo holds at most {MAX_PINS} pins.</p> : null}
        {error ? (
          <p className="wb-field-error" role="alert">
            {error}
          </p>
        ) : null}
      </DialogBody>
      <DialogFooter
        actions={
          <>
            <Button
              icon={<MapMarkerIcon />}
              variant="minimal"
              disabled={full}
              onClick={() => add({ x: 0.5, y: 0.5 })}
            >
              Pin in the middle
            </Button>
            <Button variant="outlined" onClick={onClose}>
              Done
            </Button>
            <Button
              intent={Intent.PRIMARY}
              disabled={!changed}
              loading={save.isPending}
              onClick={onSave}
            >
              Save pins
            </Button>
          </>
        }
      />
    </>
  );
}

/** One photo at full size, with its pins; parents and tutors alike may place them. */
export function PhotoDialog({
  missId,
  photo,
  index,
  onClose,
}: {
  missId: number;
  photo: MissPhoto | null;
  index: number;
  onClose: () => void;
}) {
  const [unsaved, setUnsaved] = useState(false);
  const [asking, setAsking] = useState(false);
  const close = () => {
    setUnsaved(false);
    setAsking(false);
    onClose();
  };
  const tryClose = () => (unsaved ? setAsking(true) : close());
  return (
    <>
      <Dialog
        isOpen={photo !== null}
        onClose={tryClose}
        title={`Photo ${index + 1}`}
        className="wb-dialog wb-photo-dialog"
      >
        {photo ? (
          <PinEditor
            key={photo.id}
            missId={missId}
            photo={photo}
            index={index}
            onClose={tryClose}
            onChangedChange={setUnsaved}
          />
        ) : null}
      </Dialog>
      <LeavePinsAlert open={asking} onLeave={close} onStay={() => setAsking(false)} />
    </>
  );
}
