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
 * it came from must come from this origin. Browsers send Origin on every
 * cross-site POST; Sec-Fetch-Site tells the same for modern browsers.
 */
export const requireSameOrigin: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  const fetchSite = req.get('sec-fetch-site');
  if (fetchSite && fetchSite !== 'same-origin' && fetchSite !== 'none') {
    return next(new AppError('Cross-site requests are refused', { status: 403, code: 'cross_origin' }));
  }
  const origin = req.get('origin');
  if (origin && origin !== 'null') {
    let originHost: string;
    try {
      originHost = new URL(origin).host;
    } catch {
      return next(new AppError('Malformed Origin header', { status: 403, code: 'cross_origin' }));
    }
    if (originHost !== req.get('host')) {
      return next(new AppError('Cross-site requests are refused', { status: 403, code: 'cross_origin' }));
    }
  } else if (origin === 'null') {
    return next(new AppError('Cross-site requests are refused', { status: 403, code: 'cross_origin' }));
  }
  next();
};
