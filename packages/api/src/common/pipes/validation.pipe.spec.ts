import { BadRequestException } from '@nestjs/common';
import { describe, expect, it } from 'vitest';
import { UpdateMissDto } from '../../misses/dto/update-miss.dto.js';
import { ListMissesQuery } from '../../misses/dto/list-misses.query.js';
import { CreateNoteDto } from '../../notes/dto/create-note.dto.js';
import { CreateSittingDto } from '../../sittings/dto/create-sitting.dto.js';
import { CreateStudentDto } from '../../students/dto/create-student.dto.js';
import { createValidationPipe, MAX_NESTING } from './validation.pipe.js';

const pipe = createValidationPipe();

async function fieldsOf(
  value: unknown,
  metadata: Parameters<typeof pipe.transform>[1],
): Promise<Record<string, string>> {
  const error: unknown = await pipe.transform(value, metadata).then(
    () => undefined,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(BadRequestException);
  return ((error as BadRequestException).getResponse() as { fields: Record<string, string> })
    .fields;
}

const body = (metatype: new () => object) => ({ type: 'body' as const, metatype });

describe('control characters', () => {
  it.each([
    'Iv\u0000y',
    'Ivy\u0007',
    'Ivy\u001b[2J',
    'I\rvy',
    'Ivy\u007f',
    'Ivy\u0085',
    'I\nvy',
    'I\tvy',
  ])('refuses %j in a name, naming the field', async (name) => {
    const fields = await fieldsOf({ name, gradeLevel: '3' }, body(CreateStudentDto));
    expect(Object.keys(fields)).toEqual(['name']);
    expect(fields.name).toMatch(/control characters/);
  });

  it('keeps line breaks and tabs in a multi-line field, and nothing else', async () => {
    const ok = (await pipe.transform(
      { missId: 3, body: 'first line\n\tsecond line' },
      body(CreateNoteDto),
    )) as CreateNoteDto;
    expect(ok.body).toBe('first line\n\tsecond line');
    const fields = await fieldsOf({ missId: 3, body: 'a\r\nb\u0000' }, body(CreateNoteDto));
    expect(fields.body).toMatch(/line breaks and tabs but no other control characters/);
  });

  it('finds the marks of a PartialType and of a nested DTO', async () => {
    expect(await fieldsOf({ explanation: 'x\u0000' }, body(UpdateMissDto))).toHaveProperty(
      'explanation',
    );
    const nested = await fieldsOf(
      {
        studentId: 1,
        answerKeyId: 1,
        startedAt: '2026-03-02T09:30',
        conditions: { note: 'slept\u0000 badly' },
      },
      body(CreateSittingDto),
    );
    expect(Object.keys(nested)).toEqual(['conditions.note']);
  });

  it('refuses a NUL in a query parameter, DTO or bare', async () => {
    expect(
      await fieldsOf({ q: 'carry\u0000' }, { type: 'query', metatype: ListMissesQuery }),
    ).toHaveProperty('q');
    expect(
      await fieldsOf('a\u0000', { type: 'query', metatype: String, data: 'q' }),
    ).toHaveProperty('q');
  });
});

describe('nesting depth', () => {
  const deep = (levels: number) => {
    let value: unknown = 1;
    for (let i = 0; i < levels; i++) value = { a: value };
    return { name: 'Ivy', gradeLevel: '3', extra: value };
  };

  it(`refuses more than ${MAX_NESTING} levels before class-transformer walks them`, async () => {
    const fields = await fieldsOf(deep(3000), body(CreateStudentDto));
    expect(fields.extra).toMatch(/nested too deeply/);
  });

  it(`lets ${MAX_NESTING - 1} levels on to the usual validation`, async () => {
    const fields = await fieldsOf(deep(MAX_NESTING - 1), body(CreateStudentDto));
    expect(fields.extra).toMatch(/not a field we accept/);
  });
});

describe('whole numbers', () => {
  it.each(['0x13', '1e1', '19.0', '+19', ' 19', '１９', '0b10011'])(
    'refuses %j as an id in a query',
    async (studentId) => {
      const fields = await fieldsOf({ studentId }, { type: 'query', metatype: ListMissesQuery });
      expect(fields.studentId).toMatch(/whole number/);
    },
  );

  it.each(['0x13', '1e1', '19.0'])('refuses %j as a bare numeric parameter', async (id) => {
    expect(await fieldsOf(id, { type: 'param', metatype: Number, data: 'id' })).toHaveProperty(
      'id',
    );
  });

  it('reads plain digits', async () => {
    const q = (await pipe.transform(
      { studentId: '19' },
      { type: 'query', metatype: ListMissesQuery },
    )) as ListMissesQuery;
    expect(q.studentId).toBe(19);
    expect(await pipe.transform('19', { type: 'param', metatype: Number, data: 'id' })).toBe(19);
  });
});
