import type { AppAbility } from '../../shared/abilities';
import type { SessionUser } from '../../shared/types/session';

declare global {
  namespace Express {
    interface Locals {
      user?: SessionUser;
      ability?: AppAbility;
      /** Set by the route's guard; see middlewares/authorize.ts. */
      requirement?: string;
    }
    interface User {
      id: number;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    signedInAt?: number;
    lastSeenAt?: number;
    csrfToken?: string;
  }
}

export {};
