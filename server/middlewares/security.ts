import helmet from 'helmet';
import type { RequestHandler } from 'express';
import { AppError } from '../lib/app-error';

export function createHelmet(servedOverTls: boolean): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        // Plain HTTP on loopback must keep working; only ask for upgrades when served over TLS.
        upgradeInsecureRequests: servedOverTls ? [] : null,
      },
    },
    crossOriginEmbedderPolicy: false,
  });
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * The second half of CSRF protection: a state-changing request that says where
 * it came from must come from this application's public address (PUBLIC_URL),
 * never merely from whatever Host header the client sent. Browsers send Origin
 * on every cross-site POST; Sec-Fetch-Site tells the same for modern browsers.
 * publicUrl is read per request: with PORT=0 it is known only once listening.
 */
export function createSameOriginCheck(publicUrl: () => string): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const refused = (message = 'Cross-site requests are refused') => next(new AppError(message, { status: 403, code: 'cross_origin' }));
    const fetchSite = req.get('sec-fetch-site');
    if (fetchSite && fetchSite !== 'same-origin' && fetchSite !== 'none') return refused();
    const origin = req.get('origin');
    if (origin === undefined) return next();
    if (origin === 'null') return refused();
    let sent: string;
    try {
      sent = new URL(origin).origin;
    } catch {
      return refused('Malformed Origin header');
    }
    if (sent !== new URL(publicUrl()).origin) return refused();
    next();
  };
}
