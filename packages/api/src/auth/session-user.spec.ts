import express, { type NextFunction, type Request, type Response } from 'express';
import session from 'express-session';
import { Passport } from 'passport';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { sessionUser } from './session-user.js';

/** The app's session user (Express.User is SessionUser here). */
function userOf(id: number): Express.User {
  return {
    id,
    email: `parent${id}@example.test`,
    displayName: 'Parent A',
    emailVerified: true,
    isAdmin: false,
  };
}

/**
 * An app signed in the way the product's is: express-session, then sessionUser in place of
 * passport.session(), with one passport instance's serializers over a map of users.
 */
function appWith(users: Map<number, Express.User>, failLookup = { on: false }) {
  const passport = new Passport();
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((id: number, done) => {
    if (failLookup.on) return done(new Error('the users table is busy'));
    done(null, users.get(id) ?? false);
  });
  const app = express();
  app.use(session({ secret: 'a test secret', resave: false, saveUninitialized: false }));
  app.use(sessionUser(passport, app.request));
  app.post('/in/:id', (req, res, next) => {
    req.logIn(users.get(Number(req.params.id))!, (err) => (err ? next(err) : res.json({})));
  });
  app.post('/out', (req, res, next) => {
    req.logout((err) => (err ? next(err) : res.json({})));
  });
  app.get('/me', (req, res) => {
    const kept = (req.session as { passport?: { user?: number } }).passport;
    res.json({
      signedIn: req.isAuthenticated(),
      user: req.user ?? null,
      keptId: kept?.user ?? null,
      ownMethods: Object.keys(req).filter((k) => k === 'isAuthenticated' || k === 'logIn'),
    });
  });
  app.use((err: Error, _req: Request, res: Response, _next: NextFunction) => {
    res.status(503).json({ error: err.message });
  });
  return app;
}

// The behaviour checked is passport's own session strategy's, as its source documents it
// (lib/strategies/session.js: the user restored from the kept id, a vanished user's id dropped).
describe('sessionUser', () => {
  it('restores the signed-in user on later requests, with passport’s request methods', async () => {
    const users = new Map([[7, userOf(7)]]);
    const agent = request.agent(appWith(users));
    await agent.post('/in/7').expect(200);
    const me = await agent.get('/me').expect(200);
    expect(me.body).toEqual({
      signedIn: true,
      user: userOf(7),
      keptId: 7,
      // The methods come from the prototype, not set on each request.
      ownMethods: [],
    });
  });

  it('leaves a visitor signed out', async () => {
    const me = await request(appWith(new Map())).get('/me').expect(200);
    expect(me.body).toMatchObject({ signedIn: false, user: null, keptId: null });
  });

  it('signs out with req.logout', async () => {
    const users = new Map([[7, userOf(7)]]);
    const agent = request.agent(appWith(users));
    await agent.post('/in/7').expect(200);
    await agent.post('/out').expect(200);
    const me = await agent.get('/me').expect(200);
    expect(me.body).toMatchObject({ signedIn: false, user: null });
  });

  it('drops the kept id of a user who is gone, and the request is signed out', async () => {
    const users = new Map([[7, userOf(7)]]);
    const agent = request.agent(appWith(users));
    await agent.post('/in/7').expect(200);
    users.delete(7);
    const me = await agent.get('/me').expect(200);
    expect(me.body).toMatchObject({ signedIn: false, user: null, keptId: null });
  });

  it('passes a failing lookup to the error handler', async () => {
    const users = new Map([[7, userOf(7)]]);
    const failLookup = { on: false };
    const agent = request.agent(appWith(users, failLookup));
    await agent.post('/in/7').expect(200);
    failLookup.on = true;
    const res = await agent.get('/me').expect(503);
    expect(res.body).toEqual({ error: 'the users table is busy' });
  });
});
