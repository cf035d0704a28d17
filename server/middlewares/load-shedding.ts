// A cap on the requests one process works on at once. Past the cap a request is
// answered at once with 503 and Retry-After instead of joining a queue that only
// grows: latency stays bounded for the admitted requests, memory stays bounded
// for the process, and a load balancer or the client retries later. The health
// probe is never shed, so monitoring can tell "busy" from "down".
import type { RequestHandler } from 'express';

const SHED_BODY = Buffer.from(
  JSON.stringify({ error: { code: 'overloaded', message: 'The server is busy right now; try again in a moment' } }),
);
const SHED_HEADERS = {
  'Content-Type': 'application/json; charset=utf-8',
  'Content-Length': String(SHED_BODY.length),
  'Retry-After': '1',
  'Cache-Control': 'no-store',
  'X-Content-Type-Options': 'nosniff',
};

export interface LoadSheddingOptions {
  maxInFlight: number;
  /** Paths always admitted (exact match on the URL path). */
  exempt?: readonly string[];
  onShed?: (inFlight: number) => void;
}

export interface LoadShedding extends RequestHandler {
  /** Requests being worked on now (for tests and diagnostics). */
  inFlight(): number;
}

export function createLoadShedding({ maxInFlight, exempt = ['/api/health'], onShed }: LoadSheddingOptions): LoadShedding {
  let inFlight = 0;
  const exemptPaths = new Set(exempt);

  const middleware: RequestHandler = (req, res, next) => {
    const pathOnly = req.url.split('?', 1)[0];
    if (exemptPaths.has(pathOnly)) return next();
    if (inFlight >= maxInFlight) {
      onShed?.(inFlight);
      // Written directly, with a body built once: a refusal must cost far less than the work it refuses.
      res.writeHead(503, SHED_HEADERS);
      res.end(SHED_BODY);
      return;
    }
    inFlight += 1;
    let released = false;
    const release = () => {
      if (released) return;
      released = true;
      inFlight -= 1;
    };
    // 'finish' when the response was sent, 'close' when the client went away first.
    res.once('finish', release);
    res.once('close', release);
    next();
  };

  return Object.assign(middleware, { inFlight: () => inFlight });
}
