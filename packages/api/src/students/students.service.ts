import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op, type WhereOptions } from 'sequelize';
import type { MemberContext } from '../common/member-context.js';
import { driverDate, selectList, SqlReader } from '../database/sql-reader.js';
import type { CreateStudentDto } from './dto/create-student.dto.js';
import type { UpdateStudentDto } from './dto/update-student.dto.js';
import { Student } from './models/student.model.js';

/** A student as the API shows it, read as a plain row. */
export type StudentRow = Pick<Student, 'id' | 'name' | 'gradeLevel' | 'createdAt' | 'updatedAt'>;

const STUDENT_COLUMNS = selectList(Student, ['id', 'name', 'gradeLevel', 'createdAt', 'updatedAt']);

@Injectable()
export class StudentsService {
  constructor(
    @InjectModel(Student) private readonly studentModel: typeof Student,
    private readonly reader: SqlReader,
  ) {}

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
    return toStudentJson(await this.find(member, id));
  }

  /**
   * The student, to read: a plain row through the driver (SqlReader), as nearly every list,
   * pattern and print first checks the student is the member's. 404 as findModel.
   */
  async find(member: MemberContext, id: number): Promise<StudentRow> {
    const granted = member.studentIds === null || member.studentIds.includes(id);
    const [row] = granted
      ? await this.reader.rows<StudentRow>(
          `SELECT ${STUDENT_COLUMNS()} FROM "students" WHERE "id" = ? AND "household_id" = ?`,
          [id, member.householdId],
        )
      : [];
    if (!row) throw new NotFoundException(`No student ${id} in this household`);
    return { ...row, createdAt: driverDate(row.createdAt), updatedAt: driverDate(row.updatedAt) };
  }

  /** To change or remove: the model. 404 both for what does not exist and for what is not this member's to see. */
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

export function toStudentJson(s: StudentRow) {
  return {
    id: s.id,
    name: s.name,
    gradeLevel: s.gradeLevel,
    createdAt: s.createdAt,
    updatedAt: s.updatedAt,
  };
}
