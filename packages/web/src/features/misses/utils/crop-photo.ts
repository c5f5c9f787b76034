import { JPEG_QUALITY } from './prepare-photo';

/** A rectangle in pixels of the turned photo, as react-easy-crop reports it. */
export type CropArea = { x: number; y: number; width: number; height: number };

/** Quarter turns only: a worksheet photo is upright, sideways or upside down. */
export type QuarterTurn = 0 | 90 | 180 | 270;

function loadImage(src: string): Promise<HTMLImageElement> {
  return new Promise((resolve, reject) => {
    const image = new Image();
    image.addEventListener('load', () => resolve(image));
    image.addEventListener('error', () => reject(new Error('The photo could not be read.')));
    image.src = src;
  });
}

function toBlob(canvas: HTMLCanvasElement): Promise<Blob> {
  return new Promise((resolve, reject) =>
    canvas.toBlob(
      (blob) => (blob ? resolve(blob) : reject(new Error('The photo could not be saved.'))),
      'image/jpeg',
      JPEG_QUALITY,
    ),
  );
}

/** The whole photo turned a quarter to the left (-90) or right (90). */
export async function turnPhoto(file: File, by: 90 | -90): Promise<File> {
  const url = URL.createObjectURL(file);
  let size: { width: number; height: number };
  try {
    const image = await loadImage(url);
    size = { width: image.naturalWidth, height: image.naturalHeight };
  } finally {
    URL.revokeObjectURL(url);
  }
  return cropPhoto(
    file,
    { x: 0, y: 0, width: size.height, height: size.width },
    by === 90 ? 90 : 270,
  );
}

/**
 * The photo turned by `rotation` and cut to `area` (pixels of the turned photo), as a new JPEG
 * file. Drawn on a canvas, so it carries no metadata either.
 */
export async function cropPhoto(file: File, area: CropArea, rotation: QuarterTurn): Promise<File> {
  const url = URL.createObjectURL(file);
  try {
    const image = await loadImage(url);
    const sideways = rotation === 90 || rotation === 270;
    const turned = document.createElement('canvas');
    turned.width = sideways ? image.naturalHeight : image.naturalWidth;
    turned.height = sideways ? image.naturalWidth : image.naturalHeight;
    const ctx = turned.getContext('2d');
    if (!ctx) throw new Error('This browser cannot edit photos.');
    ctx.translate(turned.width / 2, turned.height / 2);
    ctx.rotate((rotation * Math.PI) / 180);
    ctx.drawImage(image, -image.naturalWidth / 2, -image.naturalHeight / 2);

    const out = document.createElement('canvas');
    out.width = Math.max(1, Math.round(area.width));
    out.height = Math.max(1, Math.round(area.height));
    out
      .getContext('2d')
      ?.drawImage(
        turned,
        Math.round(area.x),
        Math.round(area.y),
        out.width,
        out.height,
        0,
        0,
        out.width,
        out.height,
      );
    const blob = await toBlob(out);
    return new File([blob], file.name.replace(/\.[^./\\]*$/, '') + '.jpg', {
      type: 'image/jpeg',
      lastModified: Date.now(),
    });
  } finally {
    URL.revokeObjectURL(url);
  }
}
