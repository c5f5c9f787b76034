import { randomUUID } from 'node:crypto';
import {
  HttpException,
  HttpStatus,
  Inject,
  Injectable,
  Logger,
  PayloadTooLargeException,
} from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import sharp from 'sharp';
import { addToList } from '../common/add-to-list.js';
import type { MemberContext } from '../common/member-context.js';
import type { AppConfig } from '../config/app.config.js';
import type { NewRows } from '../database/inserts.service.js';
import { driverDate, placeholders, selectList, SqlReader } from '../database/sql-reader.js';
import { PHOTO_STORAGE, smallKeyOf, type PhotoStorage } from '../storage/photo-storage.js';
import { DecodeSlots } from './decode-slots.js';
import { Photo } from './models/photo.model.js';
import { MAX_INPUT_PIXELS } from './photo-limits.js';
import { PhotoPipeline, type ProcessedPhoto } from './photo-pipeline.service.js';

/** Which file of a photo: the display image, the thumbnail, or the list rows' small square. */
export type PhotoFileKind = 'image' | 'thumb' | 'small';

/** Every file a photo row may own. */
export const keysOf = (p: Pick<Photo, 'storageKey' | 'thumbKey'>) => [
  p.storageKey,
  p.thumbKey,
  smallKeyOf(p.storageKey),
];

/** What the pipeline needs of an upload (a multer file has it; the demo seeder makes its own). */
export interface UploadedPhoto {
  buffer: Buffer;
}

/** A processed photo whose files are written but whose row is not yet. */
export interface StagedPhoto {
  processed: ProcessedPhoto;
  storageKey: string;
  thumbKey: string;
}

export interface PhotoJson {
  id: number;
  position: number;
  contentType: string;
  width: number;
  height: number;
  bytes: number;
  thumbWidth: number;
  thumbHeight: number;
  imageUrl: string;
  thumbUrl: string;
  marks: MarkJson[];
  createdAt: Date;
}

export interface MarkJson {
  id: number;
  x: number;
  y: number;
  label: string | null;
}

@Injectable()
export class PhotosService {
  private readonly logger = new Logger(PhotosService.name);
  private readonly decodes: DecodeSlots;
  private readonly pixelBudget: number;

  constructor(
    @InjectModel(Photo) private readonly photoModel: typeof Photo,
    @Inject(PHOTO_STORAGE) private readonly storage: PhotoStorage,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly reader: SqlReader,
    private readonly pipeline: PhotoPipeline,
    config: ConfigService,
  ) {
    const { limits } = config.getOrThrow<AppConfig>('app');
    this.decodes = new DecodeSlots(limits.photoDecodesPerMember);
    this.pixelBudget = limits.photoPixelsPerRequest;
  }

  /**
   * Checks and re-encodes every upload in memory; nothing is written yet (415/422 refuse the
   * lot). A request's photos together stay within the pixel budget (413, read from the
   * headers before any decoding), and one member decodes at most a few requests at a time.
   */
  async process(
    files: readonly UploadedPhoto[],
    member?: Pick<MemberContext, 'userId'>,
  ): Promise<ProcessedPhoto[]> {
    if (files.length === 0) return [];
    await this.refuseOverPixelBudget(files);
    return this.decodes.run(String(member?.userId ?? 0), async () => {
      const out: ProcessedPhoto[] = [];
      for (const [i, file] of files.entries()) {
        out.push(
          await this.pipeline.process(file.buffer, files.length > 1 ? `photo ${i + 1}` : 'photo'),
        );
      }
      return out;
    });
  }

  private async refuseOverPixelBudget(files: readonly UploadedPhoto[]): Promise<void> {
    // One photo within the pipeline's own limit is within the budget too: the pipeline refuses
    // a larger one itself (422), so its headers need not be read first (a trip through the
    // thread pool and a turn of the event loop for every photo logged).
    if (files.length === 1 && this.pixelBudget >= MAX_INPUT_PIXELS) return;
    let pixels = 0;
    for (const file of files) {
      // Only the header is read; a file sharp cannot read (empty ones throw at once) is the
      // pipeline's to refuse (415/422).
      const meta = await Promise.resolve()
        .then(() => sharp(file.buffer).metadata())
        .catch(() => undefined);
      if (meta?.width && meta.height) pixels += meta.width * meta.height;
    }
    if (pixels > this.pixelBudget) {
      const megapixels = Math.round(this.pixelBudget / 1_000_000);
      throw new PayloadTooLargeException({
        message: `These photos are too large together (over ${megapixels} megapixels): send fewer or smaller photos`,
        fields: { photos: `together over ${megapixels} megapixels` },
      });
    }
  }

  /** Writes the files under fresh server-made names; on any failure removes what it wrote. */
  async stage(processed: readonly ProcessedPhoto[]): Promise<StagedPhoto[]> {
    const staged: StagedPhoto[] = [];
    const written: string[] = [];
    try {
      for (const p of processed) {
        const id = randomUUID();
        const item = { processed: p, storageKey: `${id}.jpg`, thumbKey: `${id}-thumb.jpg` };
        // A photo's three files are written side by side (each put is several file-system
        // round trips, and its own sync); every one that was written is removed on a failure.
        const files: [string, Buffer][] = [
          [item.storageKey, p.display.data],
          [item.thumbKey, p.thumb.data],
          [smallKeyOf(item.storageKey), p.small.data],
        ];
        const puts = await Promise.allSettled(
          files.map(async ([key, data]) => {
            await this.storage.put(key, data);
            written.push(key);
          }),
        );
        const failed = puts.find((put) => put.status === 'rejected');
        if (failed) throw failed.reason;
        staged.push(item);
      }
      return staged;
    } catch (err) {
      await this.removeKeys(written);
      if ((err as NodeJS.ErrnoException).code === 'ENOSPC') {
        throw new HttpException(
          'The server has no room for photos right now; nothing was saved',
          HttpStatus.INSUFFICIENT_STORAGE,
        );
      }
      throw err;
    }
  }

  /** Removes the files of photos whose rows were never committed. */
  async discard(staged: readonly StagedPhoto[]): Promise<void> {
    await this.removeKeys(staged.flatMap(keysOf));
  }

  /** The rows of staged photos, after the miss's last photo. */
  async createRows(
    missId: number,
    staged: readonly StagedPhoto[],
    userId: number | null,
    transaction: Transaction,
  ): Promise<void> {
    if (staged.length === 0) return;
    const last = (await this.photoModel.max<number | null, Photo>('position', {
      where: { missId },
      transaction,
    })) as number | null;
    // One INSERT for all of them: a transaction holds the write lock for each round trip.
    const { values } = this.newRows(missId, staged, userId, (last ?? 0) + 1);
    await this.photoModel.bulkCreate(values, { transaction });
  }

  /** The rows of staged photos, numbered from `first`. */
  newRows(
    missId: number,
    staged: readonly StagedPhoto[],
    userId: number | null,
    first = 1,
  ): NewRows<Photo> {
    return {
      model: this.photoModel,
      values: staged.map((s, i) => ({
        missId,
        position: first + i,
        contentType: s.processed.contentType,
        storageKey: s.storageKey,
        thumbKey: s.thumbKey,
        width: s.processed.display.width,
        height: s.processed.display.height,
        bytes: s.processed.display.data.length,
        thumbWidth: s.processed.thumb.width,
        thumbHeight: s.processed.thumb.height,
        thumbBytes: s.processed.thumb.data.length,
        createdBy: userId,
      })),
    };
  }

  async countFor(missId: number, transaction?: Transaction): Promise<number> {
    return this.photoModel.count({ where: { missId }, transaction });
  }

  /** The photos of each miss, in order, with their pins. */
  async forMisses(missIds: readonly number[]): Promise<Map<number, PhotoJson[]>> {
    const map = new Map<number, PhotoJson[]>();
    if (missIds.length === 0) return map;
    // Read on every opened miss: straight through the driver (SqlReader), not as models, and
    // the photos' marks beside the photos rather than after them.
    const inMisses = `IN (${placeholders(missIds.length)})`;
    const [photos, marks] = await Promise.all([
      this.reader.rows<PhotoRow>(
        `SELECT ${PHOTO_COLUMNS()} FROM "photos" WHERE "miss_id" ${inMisses}
         ORDER BY "miss_id", "position"`,
        missIds,
      ),
      this.marksWhere(
        `"photo_id" IN (SELECT "id" FROM "photos" WHERE "miss_id" ${inMisses})`,
        missIds,
      ),
    ]);
    for (const p of photos) {
      const json = toPhotoJson({ ...p, createdAt: driverDate(p.createdAt) }, marks.get(p.id) ?? []);
      addToList(map, p.missId, json);
    }
    return map;
  }

  /** For list rows: the first photo's id and the number of photos of each miss. */
  async thumbnails(
    missIds: readonly number[],
  ): Promise<Map<number, { id: number; count: number }>> {
    const map = new Map<number, { id: number; count: number }>();
    if (missIds.length === 0) return map;
    // Read for every notebook page: straight through the driver (SqlReader), not as models.
    const rows = await this.reader.rows<{ id: number; missId: number }>(
      `SELECT "id", "miss_id" AS "missId" FROM "photos"
       WHERE "miss_id" IN (${placeholders(missIds.length)}) ORDER BY "miss_id", "position"`,
      missIds,
    );
    for (const r of rows) {
      const seen = map.get(r.missId);
      if (seen) seen.count++;
      else map.set(r.missId, { id: r.id, count: 1 });
    }
    return map;
  }

  async keysOfMiss(missId: number, transaction?: Transaction): Promise<string[]> {
    const rows = await this.photoModel.findAll({
      attributes: ['storageKey', 'thumbKey'],
      where: { missId },
      transaction,
    });
    return rows.flatMap(keysOf);
  }

  /** Best effort: a file that cannot be removed is logged by key (no personal data) and swept later. */
  async removeKeys(keys: readonly string[]): Promise<void> {
    for (const key of keys) {
      try {
        await this.storage.remove(key);
      } catch (err) {
        this.logger.warn(`could not remove photo file ${key}: ${(err as Error).message}`);
      }
    }
  }

  /** Removes files no photo row refers to (left by a crash, or by a student or household deleted in the database). */
  async sweepOrphans(): Promise<number> {
    const stored = await this.storage.keys();
    if (stored.length === 0) return 0;
    const rows = await this.photoModel.findAll({ attributes: ['storageKey', 'thumbKey'] });
    const known = new Set(rows.flatMap(keysOf));
    const orphans = stored.filter((k) => !known.has(k));
    await this.removeKeys(orphans);
    return orphans.length;
  }

  /** The marks drawn on these photos, by photo id. */
  async marksByPhoto(photoIds: readonly number[]): Promise<Map<number, MarkJson[]>> {
    if (photoIds.length === 0) return new Map();
    return this.marksWhere(`"photo_id" IN (${placeholders(photoIds.length)})`, photoIds);
  }

  /** Photo marks by photo, of the photos `where` picks. */
  private async marksWhere(
    where: string,
    params: readonly number[],
  ): Promise<Map<number, MarkJson[]>> {
    const map = new Map<number, MarkJson[]>();
    const marks = await this.reader.rows<MarkJson & { photoId: number }>(
      `SELECT "id", "photo_id" AS "photoId", "x", "y", "label" FROM "photo_marks"
       WHERE ${where} ORDER BY "id"`,
      params,
    );
    for (const m of marks) addToList(map, m.photoId, { id: m.id, x: m.x, y: m.y, label: m.label });
    return map;
  }
}

/** The columns of a photo the app shows (toPhotoJson), as SqlReader reads them. */
const PHOTO_ATTRIBUTES = [
  'id',
  'missId',
  'position',
  'contentType',
  'width',
  'height',
  'bytes',
  'thumbWidth',
  'thumbHeight',
  'createdAt',
] as const satisfies readonly (keyof Photo)[];
const PHOTO_COLUMNS = selectList(Photo, PHOTO_ATTRIBUTES);
type PhotoRow = Pick<Photo, Exclude<(typeof PHOTO_ATTRIBUTES)[number], 'createdAt'>> & {
  createdAt: unknown;
};

export function toPhotoJson(
  p: Pick<Photo, Exclude<(typeof PHOTO_ATTRIBUTES)[number], 'missId'>>,
  marks: MarkJson[],
): PhotoJson {
  return {
    id: p.id,
    position: p.position,
    contentType: p.contentType,
    width: p.width,
    height: p.height,
    bytes: p.bytes,
    thumbWidth: p.thumbWidth,
    thumbHeight: p.thumbHeight,
    imageUrl: `/api/photos/${p.id}/image`,
    thumbUrl: `/api/photos/${p.id}/thumb`,
    marks,
    createdAt: p.createdAt,
  };
}
