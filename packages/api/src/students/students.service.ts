import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op, type WhereOptions } from 'sequelize';
import type { MemberContext } from '../common/member-context.js';
import type { CreateStudentDto } from './dto/create-student.dto.js';
import type { UpdateStudentDto } from './dto/update-student.dto.js';
import { Student } from './models/student.model.js';

@Injectable()
export class StudentsService {
  constructor(@InjectModel(Student) private readonly studentModel: typeof Student) {}

  /** The household's students a member may see: all for owners and parents, the granted ones for a tutor. */
  scope(member: MemberContext): WhereOptions<Student> {
    return member.studentIds === null
      ? { householdId: member.householdId }
      : { householdId: member.householdId, id: { [Op.in]: member.studentIds } };
  }

  async findAll(member: MemberContext) {
    const items = await this.studentModel.findAll({
      where: this.scope(member),
      order: [
        ['name', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    return { items: items.map(toStudentJson), total: items.length };
  }

  async findOne(member: MemberContext, id: number) {
    return toStudentJson(await this.findModel(member, id));
  }

  /** 404 both for what does not exist and for what is not this member's to see. */
  async findModel(member: MemberContext, id: number): Promise<Student> {
    const student = await this.studentModel.findOne({
      where: { [Op.and]: [this.scope(member), { id }] },
    });
    if (!student) throw new NotFoundException(`No student ${id} in this household`);
    return student;
  }

  async create(member: MemberContext, dto: CreateStudentDto) {
    const student = await this.studentModel.create({ ...dto, householdId: member.householdId });
    return toStudentJson(student);
  }

  async update(member: MemberContext, id: number, dto: UpdateStudentDto) {
    const student = await this.findModel(member, id);
    await student.update(dto);
    return toStudentJson(student);
  }

  async remove(member: MemberContext, id: number): Promise<void> {
    const student = await this.findModel(member, id);
    await student.destroy();
  }
}

export function toStudentJson(s: Student) {
  return {
    id: s.id,
    name: s.name,
    gradeLevel: s.gradeLevel,
    createdAt: s.createdAt,
    updatedAt: s.updatedAt,
  };
}
