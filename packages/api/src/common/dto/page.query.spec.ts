import { BadRequestException } from '@nestjs/common';
import { describe, expect, it } from 'vitest';
import { ListMissesQuery } from '../../misses/dto/list-misses.query.js';
import { ListNotesQuery } from '../../notes/dto/list-notes.query.js';
import { ListReviewPlansQuery } from '../../review-plans/dto/list-review-plans.query.js';
import { createValidationPipe } from '../pipes/validation.pipe.js';

const pipe = createValidationPipe();
const parse = (metatype: new () => object, query: Record<string, string>) =>
  pipe.transform(query, { type: 'query', metatype });

const refusal = async (metatype: new () => object, query: Record<string, string>) => {
  const error: unknown = await parse(metatype, query).catch((e: unknown) => e);
  expect(error).toBeInstanceOf(BadRequestException);
  return ((error as BadRequestException).getResponse() as { fields: Record<string, string> })
    .fields;
};

const LISTS = [ListMissesQuery, ListNotesQuery, ListReviewPlansQuery].map((metatype) => ({
  name: metatype.name,
  metatype,
}));

describe.each(LISTS)('$name pages through PageQuery', ({ metatype }) => {
  it('turns page and pageSize into numbers', async () => {
    await expect(parse(metatype, { page: '2', pageSize: '100' })).resolves.toMatchObject({
      page: 2,
      pageSize: 100,
    });
  });

  it('refuses a page below 1 and a page size over 100, naming the field', async () => {
    expect(await refusal(metatype, { page: '0' })).toEqual({
      page: 'page must be a whole number from 1',
    });
    expect(await refusal(metatype, { pageSize: '101' })).toEqual({
      pageSize: 'pageSize must be a whole number from 1 to 100',
    });
  });
});

describe('a query checked again', () => {
  it('answers the same checked values, each time in a copy of its own', async () => {
    const query = { page: '3', status: 'logged' };
    const first = (await parse(ListMissesQuery, query)) as ListMissesQuery;
    first.page = 99;
    const second = (await parse(ListMissesQuery, query)) as ListMissesQuery;
    expect(second).toBeInstanceOf(ListMissesQuery);
    expect(second).not.toBe(first);
    expect(second).toMatchObject({ page: 3, status: 'logged' });
  });

  it('refuses a bad query every time it is asked, never keeping it', async () => {
    for (let i = 0; i < 2; i++) {
      expect(await refusal(ListMissesQuery, { page: '0' })).toEqual({
        page: 'page must be a whole number from 1',
      });
    }
  });

  it('keeps each class’s results apart: the same text may be good for one and refused by another', async () => {
    await expect(parse(ListMissesQuery, { status: 'logged' })).resolves.toMatchObject({
      status: 'logged',
    });
    expect(Object.keys(await refusal(ListNotesQuery, { status: 'logged' }))).toEqual(['status']);
  });
});
