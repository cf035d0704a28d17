import type { Role } from '../roles';

/** The signed-in person as the server hands them to the client. */
export interface SessionUser {
  id: number;
  email: string;
  displayName: string;
  roles: Role[];
  areaId: number | null;
  areaName: string | null;
  /** An administrator set this person's password: until they choose their own, nothing else is open to them. */
  passwordChangeRequired?: boolean;
}

export interface SessionResponse {
  user: SessionUser;
  /** CASL rules packed with packRules(); unpack with unpackRules(). */
  rules: unknown[];
  csrfToken: string;
}
