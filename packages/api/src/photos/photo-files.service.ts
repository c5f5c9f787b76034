import { Inject, Injectable, Logger, NotFoundException } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { type FindLock, lockIf } from '../database/row-lock.js';
import { missScope } from '../misses/miss-scope.js';
import { Miss } from '../misses/models/miss.model.js';
import { PHOTO_STORAGE, smallKeyOf, type PhotoStorage } from '../storage/photo-storage.js';
import type { MarkDto } from './dto/set-marks.dto.js';
import { PhotoMark } from './models/photo-mark.model.js';
import { Photo } from './models/photo.model.js';
import { smallThumb } from './photo-pipeline.service.js';
import {
  keysOf,
  PhotosService,
  toPhotoJson,
  type PhotoFileKind,
  type PhotoJson,
} from './photos.service.js';

/** One stored photo as a member reaches it: its files served, its marks drawn, the photo deleted. */
@Injectable()
export class PhotoFilesService {
  private readonly logger = new Logger(PhotoFilesService.name);

  constructor(
    @InjectModel(Photo) private readonly photoModel: typeof Photo,
    @InjectModel(PhotoMark) private readonly markModel: typeof PhotoMark,
    @Inject(PHOTO_STORAGE) private readonly storage: PhotoStorage,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly photos: PhotosService,
  ) {}

  /** A photo of a miss the member may see; 404 for anything else. `lock`: rowLock. */
  async findModel(
    member: MemberContext,
    id: number,
    transaction?: Transaction,
    find: FindLock = {},
  ): Promise<Photo> {
    const photo = await this.photoModel.findOne({
      where: { id },
      include: [{ model: Miss, attributes: ['id'], where: missScope(member), required: true }],
      transaction,
      lock: lockIf(find, transaction, this.photoModel),
    });
    if (!photo) throw new NotFoundException(`No photo ${id} in this household`);
    return photo;
  }

  async file(
    member: MemberContext,
    id: number,
    which: PhotoFileKind,
  ): Promise<{ data: Buffer; contentType: string }> {
    const photo = await this.findModel(member, id);
    if (which === 'small') return { data: await this.small(photo), contentType: 'image/jpeg' };
    const data = await this.storage.read(which === 'image' ? photo.storageKey : photo.thumbKey);
    return { data, contentType: photo.contentType };
  }

  /**
   * The list rows' small square. A photo saved before squares were made gets its own on first
   * request, cut from its thumbnail (already re-encoded, no metadata) and kept; two requests at
   * once write the same bytes under the same key, so either may win.
   */
  private async small(photo: Photo): Promise<Buffer> {
    const key = smallKeyOf(photo.storageKey);
    try {
      return await this.storage.read(key);
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err;
    }
    const { data } = await smallThumb(await this.storage.read(photo.thumbKey));
    try {
      await this.storage.put(key, data);
    } catch (err) {
      // Still shown: it is made again next time.
      this.logger.warn(`could not keep photo file ${key}: ${(err as Error).message}`);
    }
    return data;
  }

  async setMarks(member: MemberContext, id: number, marks: readonly MarkDto[]): Promise<PhotoJson> {
    const photo = await this.sequelize.transaction(async (transaction) => {
      // Its row first: two saves of its pins at once go in turn, and the second removes the
      // first's pins instead of only those there were before (every pin was left doubled).
      const found = await this.findModel(member, id, transaction, { lock: true });
      await this.markModel.destroy({ where: { photoId: id }, transaction });
      await this.markModel.bulkCreate(
        marks.map((m) => ({
          photoId: id,
          x: m.x,
          y: m.y,
          label: m.label?.length ? m.label : null,
          createdBy: member.userId,
        })),
        { transaction },
      );
      return found;
    });
    const saved = await this.photos.marksByPhoto([id]);
    return toPhotoJson(photo, saved.get(id) ?? []);
  }

  async remove(member: MemberContext, id: number): Promise<void> {
    const keys = await this.sequelize.transaction(async (transaction) => {
      const photo = await this.findModel(member, id, transaction);
      await photo.destroy({ transaction });
      return keysOf(photo);
    });
    await this.photos.removeKeys(keys);
  }
}
