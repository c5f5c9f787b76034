import { Logger } from '@nestjs/common';
import type { Request, Response } from 'express';
import {
  ConnectionAcquireTimeoutError,
  ConnectionRefusedError,
  DatabaseError,
  TimeoutError,
} from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MetricsService } from '../../metrics/metrics.service.js';
import { HttpExceptionFilter } from './http-exception.filter.js';

// The codes the tests on a real PostgreSQL cannot easily bring about (test/database-faults.pg.test.ts
// brings about 57P01, 55P03 and a refused connection). SQLSTATEs from PostgreSQL's manual,
// Appendix A "PostgreSQL Error Codes".
const metrics = new MetricsService();
const filter = new HttpExceptionFilter(metrics);
// The filter logs each 5xx; these are on purpose.
beforeAll(() => Logger.overrideLogger(false));
afterAll(() => metrics.onModuleDestroy());

function answer(exception: unknown) {
  const out: { status?: number; headers: Record<string, string>; body?: unknown } = {
    headers: {},
  };
  const res = {
    headersSent: false,
    setHeader: (name: string, value: string) => (out.headers[name.toLowerCase()] = value),
    status: (code: number) => ((out.status = code), res),
    json: (body: unknown) => ((out.body = body), res),
  };
  filter.respond(exception, { id: 'test' } as unknown as Request, res as unknown as Response);
  return out;
}

/** A driver error with a SQLSTATE, wrapped as Sequelize wraps a failed query. */
function pgError(code: string, message: string): DatabaseError {
  return new DatabaseError(Object.assign(new Error(message), { code, sql: 'SELECT 1' }) as never);
}

describe('a busy or unreachable database', () => {
  it.each([
    ['40001', 'could not serialize access due to concurrent update'],
    ['40P01', 'deadlock detected'],
    ['55P03', 'canceling statement due to lock timeout'],
    ['57014', 'canceling statement due to statement timeout'],
  ])('PostgreSQL %s is "busy": 503, Retry-After, a plain message', (code, message) => {
    const out = answer(pgError(code, message));
    expect(out.status).toBe(503);
    expect(Number(out.headers['retry-after'])).toBeGreaterThan(0);
    expect(out.body).toMatchObject({ message: expect.stringMatching(/busy with other changes/) });
    expect(JSON.stringify(out.body)).not.toContain(message);
  });

  it.each([
    ['57P01', 'terminating connection due to administrator command'],
    ['57P03', 'the database system is starting up'],
    ['53300', 'sorry, too many clients already'],
    ['08006', 'connection failure'],
  ])('PostgreSQL %s is "out of reach": 503, Retry-After', (code, message) => {
    const out = answer(pgError(code, message));
    expect(out.status).toBe(503);
    expect(Number(out.headers['retry-after'])).toBeGreaterThan(0);
    expect(out.body).toMatchObject({ message: expect.stringMatching(/cannot reach its database/) });
  });

  it('Sequelize connection errors (refused, pool acquire timeout) are "out of reach"', () => {
    for (const e of [
      new ConnectionRefusedError(
        Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' }),
      ),
      new ConnectionAcquireTimeoutError(new Error('Operation timeout')),
    ]) {
      const out = answer(e);
      expect(out.status).toBe(503);
      expect(out.headers['retry-after']).toBeDefined();
    }
  });

  it("SQLite's SQLITE_BUSY (Sequelize's TimeoutError) is busy", () => {
    const busy = new TimeoutError(
      Object.assign(new Error('SQLITE_BUSY: database is locked'), { code: 'SQLITE_BUSY' }) as never,
    );
    const out = answer(busy);
    expect(out.status).toBe(503);
    expect(out.headers['retry-after']).toBeDefined();
  });

  it('any other database error stays a 500 that names nothing of it, without Retry-After', () => {
    const out = answer(pgError('42P01', 'relation "students" does not exist'));
    expect(out.status).toBe(500);
    expect(out.headers['retry-after']).toBeUndefined();
    expect(JSON.stringify(out.body)).not.toContain('students');
  });
});
