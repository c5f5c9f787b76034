import type { NextFunction, Request, RequestHandler, Response } from 'express';
import helmet from 'helmet';
import type { AppConfig } from '../../config/app.config.js';

export const strictCsp = {
  defaultSrc: ["'self'"],
  scriptSrc: ["'self'"],
  styleSrc: ["'self'"],
  imgSrc: ["'self'", 'data:', 'blob:'],
  fontSrc: ["'self'"],
  connectSrc: ["'self'"],
  objectSrc: ["'none'"],
  baseUri: ["'none'"],
  formAction: ["'self'"],
  frameAncestors: ["'none'"],
};

/**
 * Helmet's headers in two sets. Over plain http (a phone on the home Wi-Fi opening
 * http://workback.home:3000) the https-only ones would break the page: upgrade-insecure-requests
 * rewrites every script and style to https, and browsers ignore HSTS and the opener policy there.
 */
export function securityHeaders(config: AppConfig, directives: typeof strictCsp) {
  const xFrameOptions = { action: 'deny' as const };
  return {
    https: fixedHeaders(
      helmet({
        xFrameOptions,
        strictTransportSecurity: config.env === 'production' ? undefined : false,
        contentSecurityPolicy: { directives: { ...directives, upgradeInsecureRequests: [] } },
      }),
    ),
    http: fixedHeaders(
      helmet({
        xFrameOptions,
        strictTransportSecurity: false,
        crossOriginOpenerPolicy: false,
        contentSecurityPolicy: { directives: { ...directives, upgradeInsecureRequests: null } },
      }),
    ),
  };
}

/**
 * The headers a helmet middleware sets, taken once and then set by one loop per response.
 * With fixed directives (no per-request nonce) helmet's answer is the same for every request,
 * and running its dozen small middlewares on each one was a measurable part of a request.
 */
function fixedHeaders(middleware: RequestHandler): RequestHandler {
  const headers: [string, string][] = [];
  const recorder = {
    setHeader: (name: string, value: string | number) => headers.push([name, String(value)]),
    removeHeader: () => undefined,
  };
  let done = false;
  void middleware({} as Request, recorder as unknown as Response, () => (done = true));
  if (!done) throw new Error('The security headers must not depend on the request');
  return (_req: Request, res: Response, next: NextFunction) => {
    for (const [name, value] of headers) res.setHeader(name, value);
    next();
  };
}
