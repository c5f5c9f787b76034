import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { MemberContext } from '../common/member-context.js';
import { missScope } from '../misses/miss-scope.js';
import { MissesService } from '../misses/misses.service.js';
import { Miss } from '../misses/models/miss.model.js';
import { User } from '../users/models/user.model.js';
import type { CreateNoteDto } from './dto/create-note.dto.js';
import type { ListNotesQuery } from './dto/list-notes.query.js';
import { Note } from './models/note.model.js';

@Injectable()
export class NotesService {
  constructor(
    @InjectModel(Note) private readonly noteModel: typeof Note,
    private readonly misses: MissesService,
  ) {}

  /** One miss's thread oldest first, or the newest notes across the misses the member may see. */
  async findAll(member: MemberContext, query: ListNotesQuery) {
    if (query.missId !== undefined) await this.misses.findModel(member, query.missId);
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 50;
    const { rows, count } = await this.noteModel.findAndCountAll({
      where: query.missId === undefined ? {} : { missId: query.missId },
      include: [
        { model: Miss, attributes: ['id'], where: missScope(member), required: true },
        { model: User, attributes: ['id', 'displayName'] },
      ],
      order:
        query.missId === undefined
          ? [
              ['createdAt', 'DESC'],
              ['id', 'DESC'],
            ]
          : [
              ['createdAt', 'ASC'],
              ['id', 'ASC'],
            ],
      limit: pageSize,
      offset: (page - 1) * pageSize,
    });
    return { items: rows.map(toNoteJson), total: count, page, pageSize };
  }

  async create(member: MemberContext, dto: CreateNoteDto) {
    const miss = await this.misses.findModel(member, dto.missId);
    const note = await this.noteModel.create({
      missId: miss.id,
      authorId: member.userId,
      body: dto.body,
    });
    const saved = await this.noteModel.findByPk(note.id, {
      include: [{ model: User, attributes: ['id', 'displayName'] }],
      rejectOnEmpty: true,
    });
    return toNoteJson(saved);
  }
}

export function toNoteJson(n: Note) {
  return {
    id: n.id,
    missId: n.missId,
    body: n.body,
    author: n.author ? { id: n.author.id, displayName: n.author.displayName } : null,
    createdAt: n.createdAt,
  };
}
