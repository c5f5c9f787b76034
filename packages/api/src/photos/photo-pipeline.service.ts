import {
  Injectable,
  UnprocessableEntityException,
  UnsupportedMediaTypeException,
} from '@nestjs/common';
import sharp from 'sharp';
import { detectImageType } from './detect-image-type.js';
import {
  ACCEPTED_TYPES_TEXT,
  DISPLAY_LONGEST_SIDE,
  MAX_INPUT_PIXELS,
  SMALL_THUMB_SIDE,
  THUMB_LONGEST_SIDE,
} from './photo-limits.js';

export interface EncodedImage {
  data: Buffer;
  width: number;
  height: number;
}

export interface ProcessedPhoto {
  contentType: 'image/jpeg';
  display: EncodedImage;
  thumb: EncodedImage;
  /** The list rows' square thumbnail (SMALL_THUMB_SIDE). */
  small: EncodedImage;
}

/**
 * The list rows' square thumbnail, cut from the middle of an image already re-encoded (the
 * thumbnail, or the display image): no metadata to carry over.
 */
export async function smallThumb(image: Buffer): Promise<EncodedImage> {
  const out = await sharp(image, { failOn: 'error' })
    .resize(SMALL_THUMB_SIDE, SMALL_THUMB_SIDE, { fit: 'cover', withoutEnlargement: true })
    .jpeg({ quality: 78 })
    .toBuffer({ resolveWithObject: true });
  return { data: out.data, width: out.info.width, height: out.info.height };
}

/**
 * Checks an uploaded photo and re-encodes it: upright (EXIF orientation applied), no
 * metadata at all (EXIF, GPS, camera serials, XMP, ICC are dropped by re-encoding),
 * a display image, a thumbnail and a small square for list rows, all JPEG so PDFs can embed
 * them as they are.
 */
@Injectable()
export class PhotoPipeline {
  async process(input: Buffer, label = 'photo'): Promise<ProcessedPhoto> {
    const type = detectImageType(input);
    if (type === null) {
      throw new UnsupportedMediaTypeException(
        `The ${label} is not an image we can read: send a ${ACCEPTED_TYPES_TEXT} photo`,
      );
    }
    if (type === 'heic') {
      throw new UnsupportedMediaTypeException(
        `The ${label} is HEIC, which this server cannot read: send a ${ACCEPTED_TYPES_TEXT} photo (phones can save or share photos as JPEG)`,
      );
    }
    try {
      const display = await sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' })
        .autoOrient()
        .resize(DISPLAY_LONGEST_SIDE, DISPLAY_LONGEST_SIDE, {
          fit: 'inside',
          withoutEnlargement: true,
        })
        .flatten({ background: '#ffffff' })
        .jpeg({ quality: 82, chromaSubsampling: '4:2:0' })
        .toBuffer({ resolveWithObject: true });
      // Both from the display image, side by side: JPEG shrink-on-load makes each decode of it
      // small, and the photo is ready a pipeline sooner than with the square cut from the thumb.
      const [thumb, small] = await Promise.all([
        sharp(display.data)
          .resize(THUMB_LONGEST_SIDE, THUMB_LONGEST_SIDE, {
            fit: 'inside',
            withoutEnlargement: true,
          })
          .jpeg({ quality: 78 })
          .toBuffer({ resolveWithObject: true }),
        smallThumb(display.data),
      ]);
      return {
        contentType: 'image/jpeg',
        display: { data: display.data, width: display.info.width, height: display.info.height },
        thumb: { data: thumb.data, width: thumb.info.width, height: thumb.info.height },
        small,
      };
    } catch (err) {
      throw new UnprocessableEntityException(refusal(label, err));
    }
  }
}

function refusal(label: string, err: unknown): string {
  const message = err instanceof Error ? err.message : '';
  if (/pixel limit/i.test(message)) {
    return `The ${label} has too many pixels (over ${MAX_INPUT_PIXELS / 1_000_000} megapixels): send a smaller photo`;
  }
  return `The ${label} looks damaged or incomplete and could not be read: take or send it again`;
}
