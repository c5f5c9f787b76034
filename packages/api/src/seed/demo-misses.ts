import { readFile } from 'node:fs/promises';
import { Injectable } from '@nestjs/common';
import type { Cause, MissStatus } from '@workback/core';
import sharp from 'sharp';
import type { MemberContext } from '../common/member-context.js';
import { HouseholdsService } from '../households/households.service.js';
import { MissesService } from '../misses/misses.service.js';
import { NotesService } from '../notes/notes.service.js';
import { PhotoFilesService } from '../photos/photo-files.service.js';
import { StudentsService } from '../students/students.service.js';
import { UsersService } from '../users/users.service.js';
import { drawWorking } from './handwriting.js';

export const DEMO_MISSES_FILE = new URL('../../../../seeds/demo-misses.json', import.meta.url);

type Who = 'owner' | 'coparent' | 'tutor';

interface DemoMiss {
  student: string;
  daysAgo: number;
  by: Who;
  problem: string;
  answer: string;
  explanation: string;
  cause: Cause;
  status: MissStatus;
  skills?: string[];
  revisit?: string[];
  notes?: { by: Who; body: string }[];
  pins?: { x: number; y: number; label?: string }[];
}

const EMAILS: Record<Who, string> = {
  owner: 'parent@workback.test',
  coparent: 'coparent@workback.test',
  tutor: 'tutor@workback.test',
};

/** The demo household's misses, each with a drawn photo, through the same services as a parent's upload. */
@Injectable()
export class DemoMissesSeeder {
  constructor(
    private readonly users: UsersService,
    private readonly households: HouseholdsService,
    private readonly students: StudentsService,
    private readonly misses: MissesService,
    private readonly notes: NotesService,
    private readonly photoFiles: PhotoFilesService,
  ) {}

  async seed(householdId: number, today = new Date()): Promise<number> {
    const { misses } = JSON.parse(await readFile(DEMO_MISSES_FILE, 'utf8')) as {
      misses: DemoMiss[];
    };
    const members = new Map<Who, MemberContext>();
    for (const who of Object.keys(EMAILS) as Who[]) {
      const user = await this.users.findByEmail(EMAILS[who]);
      const member = user && (await this.households.resolveMember(user.id, householdId));
      if (member) members.set(who, member);
    }
    const owner = members.get('owner');
    if (!owner) throw new Error('The demo owner is missing');
    const byName = new Map((await this.students.findAll(owner)).items.map((s) => [s.name, s.id]));
    for (const [i, m] of misses.entries()) {
      const member = members.get(m.by) ?? owner;
      const day = new Date(today.getTime() - m.daysAgo * 86_400_000).toISOString().slice(0, 10);
      const svg = drawWorking({ problem: m.problem, answer: m.answer, seed: i + 1 });
      const photo = await sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
      const miss = await this.misses.create(
        member,
        {
          studentId: byName.get(m.student)!,
          occurredOn: day,
          problem: m.problem,
          answer: m.answer,
          explanation: m.explanation,
          cause: m.cause,
          status: m.status,
          skills: m.skills,
          revisit: m.revisit,
        },
        [{ buffer: photo }],
      );
      for (const note of m.notes ?? []) {
        await this.notes.create(members.get(note.by) ?? owner, {
          missId: miss.id,
          body: note.body,
        });
      }
      if (m.pins && miss.photos[0])
        await this.photoFiles.setMarks(member, miss.photos[0].id, m.pins);
    }
    return misses.length;
  }
}
