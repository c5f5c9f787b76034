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
