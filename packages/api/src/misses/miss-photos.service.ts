import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { MAX_PHOTOS_PER_MISS } from '../photos/photo-limits.js';
import { PhotosService, type StagedPhoto, type UploadedPhoto } from '../photos/photos.service.js';
import { MissesService } from './misses.service.js';

/** Photos added to a miss after it was logged (a miss is logged with its first photos). */
@Injectable()
export class MissPhotosService {
  constructor(
    private readonly misses: MissesService,
    private readonly photos: PhotosService,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  async addPhotos(member: MemberContext, id: number, files: readonly UploadedPhoto[]) {
    // 404 before any decoding; the photos are decoded and written outside the transaction, so
    // the write lock never waits on that slow work.
    await this.misses.findModel(member, id);
    if (files.length === 0) throw fieldsError({ photos: 'attach 1 to 4 photos' });
    const processed = await this.photos.process(files, member);
    let staged: StagedPhoto[] = [];
    try {
      staged = await this.photos.stage(processed);
      await this.sequelize.transaction(async (transaction) => {
        // Locked before counting: two uploads at once go in turn on PostgreSQL, and the second
        // counts and numbers after the first's photos (they passed the limit and shared positions).
        const miss = await this.misses.findModel(member, id, transaction, { lock: true });
        const have = await this.photos.countFor(miss.id, transaction);
        if (have + staged.length > MAX_PHOTOS_PER_MISS) {
          throw fieldsError({
            photos: `a miss holds at most ${MAX_PHOTOS_PER_MISS} photos; this one has ${have}`,
          });
        }
        await this.photos.createRows(miss.id, staged, member.userId, transaction);
        await miss.update({ updatedBy: member.userId }, { transaction });
      });
    } catch (err) {
      await this.photos.discard(staged);
      throw err;
    }
    return this.misses.findOne(member, id);
  }
}
