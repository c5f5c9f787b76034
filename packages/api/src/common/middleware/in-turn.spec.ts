import express, { type NextFunction, type Request, type Response } from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { inTurn } from './in-turn.js';

type Handler = (req: Request, res: Response, next: NextFunction) => unknown;

/** An app whose first layer is `inTurn(...handlers)`, then a route, then an error handler. */
function appWith(...handlers: Handler[]) {
  const app = express();
  app.use(inTurn(...(handlers as express.RequestHandler[])));
  app.get('/', (req, res) => {
    res.json({ seen: (req as Request & { seen?: string[] }).seen ?? [] });
  });
  app.use((err: Error, _req: Request, res: Response, _next: NextFunction) => {
    res.status(418).json({ error: err.message });
  });
  return app;
}

const mark =
  (name: string): Handler =>
  (req, _res, next) => {
    const r = req as Request & { seen?: string[] };
    (r.seen ??= []).push(name);
    next();
  };

// The contract checked is Express's own for middleware, as its guide states it ("Writing
// middleware", "Error handling"): the same handlers as separate layers behave so.
describe('inTurn', () => {
  it('runs every handler in order, then the next layer', async () => {
    const res = await request(appWith(mark('a'), mark('b'), mark('c')))
      .get('/')
      .expect(200);
    expect(res.body.seen).toEqual(['a', 'b', 'c']);
  });

  it('reads next(null) as no error, as Express does', async () => {
    const res = await request(appWith(mark('a'), (_req, _res, next) => next(null), mark('b'))).get(
      '/',
    );
    expect(res.status).toBe(200);
    expect(res.body.seen).toEqual(['a', 'b']);
  });

  it('passes an error from next(err), a throw or a rejected promise to the error handler', async () => {
    const later = mark('never');
    const failures: Handler[] = [
      (_req, _res, next) => next(new Error('by next')),
      () => {
        throw new Error('by throw');
      },
      async () => {
        await Promise.resolve();
        throw new Error('by rejection');
      },
    ];
    // After a handler that goes on later (as a session store's read does), so Express's own
    // try/catch around the layer is no longer on the stack.
    const goOnLater: Handler = (_req, _res, next) => setImmediate(next);
    for (const fail of failures) {
      const res = await request(appWith(mark('a'), goOnLater, fail, later)).get('/');
      expect(res.status).toBe(418);
      expect(res.body.error).toMatch(/^by (next|throw|rejection)$/);
    }
  });

  it('lets a handler answer without going on', async () => {
    const res = await request(
      appWith(mark('a'), (_req, res) => res.status(204).end(), mark('b')),
    ).get('/');
    expect(res.status).toBe(204);
  });
});
