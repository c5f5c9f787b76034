/** Upload limits for photos of missed work (issue 4). */
export const MAX_PHOTOS_PER_MISS = 4;
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
/** About 50 megapixels: a 12 MP phone photo passes, a decompression bomb does not. */
export const MAX_INPUT_PIXELS = 50_000_000;
export const DISPLAY_LONGEST_SIDE = 2048;
export const THUMB_LONGEST_SIDE = 400;
/** The list rows' thumbnail: a square this many pixels wide, cut from the middle (64 px at 2x). */
export const SMALL_THUMB_SIDE = 128;
export const ACCEPTED_TYPES_TEXT = 'JPEG, PNG or WebP';
