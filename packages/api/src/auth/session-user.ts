import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { PassportStatic } from 'passport';

/** The two parts of a passport instance this uses. */
type Passport = Pick<PassportStatic, 'authenticate' | 'deserializeUser'>;

/** What passport.authenticate() gives each request it sees, by name. */
const REQUEST_METHODS = [
  'login',
  'logIn',
  'logout',
  'logOut',
  'isAuthenticated',
  'isUnauthenticated',
  '_sessionManager',
] as const;

/**
 * passport.session()'s work, without the setup passport.authenticate() repeats for each request:
 * a strategy object, five closures, and six methods set on the request itself (about 11 kB
 * allocated per signed-in request, measured with V8's sampling heap profiler). The methods are
 * the same for every request, so they are taken once from one run of passport.authenticate() and
 * put on Express's request prototype (`requestPrototype`, the app's `app.request`); routes and
 * passport's own sign-in (`passport.authenticate('local')`) find them there.
 *
 * The user is read as passport's session strategy reads it: the id kept under
 * `req.session.passport.user`, turned back into the user by the registered deserializer
 * (SessionSerializer); an id whose user is gone is dropped from the session.
 */
export function sessionUser(passport: Passport, requestPrototype: object): RequestHandler {
  lendRequestMethods(passport, requestPrototype);
  return (req: Request, _res: Response, next: NextFunction) => {
    const kept = (req.session as { passport?: { user?: unknown } } | undefined)?.passport;
    const id = kept?.user;
    // passport's own test: any id but a missing or empty one (0 is an id).
    if (!id && id !== 0) return next();
    passport.deserializeUser(id, req, (err: unknown, user?: Express.User | false) => {
      if (err) return next(err);
      if (user) req.user = user;
      else delete kept!.user;
      next();
    });
  };
}

/**
 * Puts the request methods passport.authenticate() sets (req.logIn, req.isAuthenticated, …) on
 * the request prototype. They are read from one run against a request without a session, which
 * passport's session strategy refuses at once; start-up fails if any is missing, rather than a
 * sign-in failing later.
 */
function lendRequestMethods(passport: Passport, requestPrototype: object): void {
  const probe: Record<string, unknown> = {};
  passport.authenticate('session')(probe, {}, () => undefined);
  for (const name of REQUEST_METHODS) {
    if (probe[name] === undefined) {
      throw new Error(`passport.authenticate() no longer sets req.${name}: see session-user.ts`);
    }
    Object.defineProperty(requestPrototype, name, {
      value: probe[name],
      writable: true,
      configurable: true,
    });
  }
}
