import type { Pica } from 'pica';

/** The size the server keeps (its display image); nothing larger is worth sending. */
export const LONGEST_SIDE = 2048;
/** The server re-encodes at quality 82 too, so sending more detail than that buys nothing. */
export const JPEG_QUALITY = 0.82;

let resizer: Promise<Pica> | null = null;

/**
 * pica's split build: the resizing runs in its worker, served from our own origin (no blob: URL
 * for the CSP to allow), and falls back to the page where workers are missing. Loaded on the
 * first photo only.
 */
function getResizer(): Promise<Pica> {
  resizer ??= Promise.all([import('pica/pica_main'), import('pica/pica_worker?url')]).then(
    ([{ default: createPica }, { default: workerURL }]) =>
      createPica({ features: ['js', 'ww'], workerURL }),
  );
  return resizer;
}

const jpegName = (name: string) => `${name.replace(/\.[^./\\]*$/, '') || 'photo'}.jpg`;

/**
 * A phone photo made ready to send: turned upright as the camera recorded it, scaled to at most
 * LONGEST_SIDE pixels on its longest side, and re-encoded as JPEG, which keeps no location or
 * camera details. A file this browser cannot decode is returned as it is: the server checks,
 * converts and strips every photo anyway.
 */
export async function preparePhoto(file: File): Promise<File> {
  if (typeof createImageBitmap !== 'function' || typeof document === 'undefined') return file;
  let bitmap: ImageBitmap;
  try {
    bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
  } catch {
    return file;
  }
  try {
    const scale = Math.min(1, LONGEST_SIDE / Math.max(bitmap.width, bitmap.height));
    const canvas = document.createElement('canvas');
    canvas.width = Math.max(1, Math.round(bitmap.width * scale));
    canvas.height = Math.max(1, Math.round(bitmap.height * scale));
    const pica = await getResizer();
    await pica.resize(bitmap, canvas);
    const blob = await pica.toBlob(canvas, 'image/jpeg', JPEG_QUALITY);
    return new File([blob], jpegName(file.name), { type: 'image/jpeg', lastModified: Date.now() });
  } catch {
    return file;
  } finally {
    bitmap.close();
  }
}

/** Every photo prepared, in order, at most two at a time (a phone has little memory to spare). */
export async function preparePhotos(files: readonly File[]): Promise<File[]> {
  const out: File[] = [];
  for (let i = 0; i < files.length; i += 2) {
    out.push(...(await Promise.all(files.slice(i, i + 2).map(preparePhoto))));
  }
  return out;
}
