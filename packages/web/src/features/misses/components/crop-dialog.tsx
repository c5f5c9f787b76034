import { Button, ButtonGroup, Dialog, DialogBody, DialogFooter, Intent } from '@blueprintjs/core';
import { ImageRotateLeftIcon, ImageRotateRightIcon } from '@blueprintjs/icons';
import { useEffect, useMemo, useState } from 'react';
import Cropper, { type Area, type MediaSize } from 'react-easy-crop';
import 'react-easy-crop/react-easy-crop.css';

import { cropPhoto, turnPhoto } from '../utils/crop-photo';

type Shape = 'photo' | 'square' | 'wide' | 'tall';

const SHAPES: { value: Shape; label: string }[] = [
  { value: 'photo', label: 'Whole photo' },
  { value: 'wide', label: 'Wide' },
  { value: 'tall', label: 'Tall' },
  { value: 'square', label: 'Square' },
];

function aspectOf(shape: Shape, media: MediaSize | null): number {
  if (shape === 'square') return 1;
  if (shape === 'wide') return 4 / 3;
  if (shape === 'tall') return 3 / 4;
  return media ? media.naturalWidth / media.naturalHeight : 4 / 3;
}

function CropEditor({
  file,
  onDone,
  onClose,
}: {
  file: File;
  onDone: (file: File) => void;
  onClose: () => void;
}) {
  // Turning redraws the photo itself, so the cropper always shows it upright and whole.
  const [source, setSource] = useState(file);
  const url = useMemo(() => URL.createObjectURL(source), [source]);
  useEffect(() => () => URL.revokeObjectURL(url), [url]);
  const [crop, setCrop] = useState({ x: 0, y: 0 });
  const [zoom, setZoom] = useState(1);
  const [shape, setShape] = useState<Shape>('photo');
  const [media, setMedia] = useState<MediaSize | null>(null);
  const [area, setArea] = useState<Area | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  const turn = async (by: 90 | -90) => {
    setBusy(true);
    setError(null);
    try {
      setMedia(null);
      setArea(null);
      setCrop({ x: 0, y: 0 });
      setZoom(1);
      setSource(await turnPhoto(source, by));
    } catch (e) {
      setError(e instanceof Error ? e.message : 'The photo could not be turned.');
    } finally {
      setBusy(false);
    }
  };

  const apply = async () => {
    if (!area) return;
    setBusy(true);
    setError(null);
    try {
      onDone(await cropPhoto(source, area, 0));
    } catch (e) {
      setError(e instanceof Error ? e.message : 'The photo could not be changed.');
      setBusy(false);
    }
  };

  return (
    <>
      <DialogBody className="wb-crop-body">
        <p className="wb-muted">
          Drag to move the photo, pinch or use the slider to zoom, and turn it upright.
        </p>
        <div className="wb-crop-stage">
          <Cropper
            image={url}
            crop={crop}
            zoom={zoom}
            aspect={aspectOf(shape, media)}
            maxZoom={5}
            disableAutomaticStylesInjection
            onCropChange={setCrop}
            onZoomChange={setZoom}
            onMediaLoaded={setMedia}
            onCropComplete={(_, pixels) => setArea(pixels)}
          />
        </div>
        <div className="wb-crop-tools">
          <ButtonGroup>
            <Button
              icon={<ImageRotateLeftIcon />}
              aria-label="Turn left"
              disabled={busy}
              onClick={() => void turn(-90)}
            />
            <Button
              icon={<ImageRotateRightIcon />}
              aria-label="Turn right"
              disabled={busy}
              onClick={() => void turn(90)}
            />
          </ButtonGroup>
          <label className="wb-crop-zoom">
            <span>Zoom</span>
            <input
              type="range"
              min={1}
              max={5}
              step={0.05}
              value={zoom}
              onChange={(e) => setZoom(Number(e.currentTarget.value))}
            />
          </label>
        </div>
        <div className="wb-crop-shapes" role="group" aria-label="Shape">
          {SHAPES.map((s) => (
            <Button
              key={s.value}
              size="small"
              variant={shape === s.value ? 'solid' : 'outlined'}
              intent={shape === s.value ? Intent.PRIMARY : Intent.NONE}
              aria-pressed={shape === s.value}
              onClick={() => setShape(s.value)}
            >
              {s.label}
            </Button>
          ))}
        </div>
        {error ? (
          <p className="wb-field-error" role="alert">
            {error}
          </p>
        ) : null}
      </DialogBody>
      <DialogFooter
        actions={
          <>
            <Button variant="outlined" onClick={onClose} disabled={busy}>
              Cancel
            </Button>
            <Button
              intent={Intent.PRIMARY}
              loading={busy}
              disabled={!area}
              onClick={() => void apply()}
            >
              Use it
            </Button>
          </>
        }
      />
    </>
  );
}

/** Crop and turn one photo before it is sent; the result replaces it in the list. */
export function CropDialog({
  file,
  index,
  onDone,
  onClose,
}: {
  file: File | null;
  index: number;
  onDone: (file: File) => void;
  onClose: () => void;
}) {
  return (
    <Dialog
      isOpen={file !== null}
      onClose={onClose}
      title={`Crop or turn photo ${index + 1}`}
      className="wb-dialog wb-crop-dialog"
    >
      {file ? <CropEditor file={file} onDone={onDone} onClose={onClose} /> : null}
    </Dialog>
  );
}
