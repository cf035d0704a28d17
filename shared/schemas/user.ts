import { z } from 'zod';
import { ROLES } from '../roles';
import { ListQueryBaseSchema } from './common';

// Length only, no composition rules; long passphrases welcome.
export const PasswordSchema = z
  .string()
  .min(12, 'use at least 12 characters')
  .max(128, 'use at most 128 characters');

/** A person choosing their own password: the one they have, and the new one. */
export const PasswordChangeSchema = z
  .object({
    currentPassword: z.string().min(1, 'enter the password you signed in with').max(1024),
    newPassword: PasswordSchema,
  })
  .strict();

export type PasswordChangeInput = z.infer<typeof PasswordChangeSchema>;

/** Roles that sign records (closure, verification): nobody grants them to themself. */
export const SIGNING_ROLES = ['quality_manager', 'accountable_manager'] as const;

const RolesSchema = z.array(z.enum(ROLES)).min(1, 'give the user at least one role').max(ROLES.length);

export const UserCreateSchema = z
  .object({
    email: z.string().trim().toLowerCase().email('enter a valid e-mail address').max(254),
    displayName: z.string().trim().min(1, 'enter the name as it should be printed').max(120),
    password: PasswordSchema,
    roles: RolesSchema,
    areaId: z.number().int().positive().nullable().default(null),
  })
  .strict();

export const UserUpdateSchema = z
  .object({
    version: z.number().int().min(0),
    displayName: z.string().trim().min(1).max(120).optional(),
    roles: RolesSchema.optional(),
    areaId: z.number().int().positive().nullable().optional(),
    active: z.boolean().optional(),
    password: PasswordSchema.optional(),
    mailDigest: z.boolean().optional(),
  })
  .strict();

export const UserListQuerySchema = ListQueryBaseSchema.extend({
  role: z.enum(ROLES).optional(),
  active: z.enum(['true', 'false']).optional(),
}).strict();

export type UserCreateInput = z.infer<typeof UserCreateSchema>;
export type UserUpdateInput = z.infer<typeof UserUpdateSchema>;

export interface UserView {
  id: number;
  email: string;
  displayName: string;
  roles: string[];
  areaId: number | null;
  areaName: string | null;
  active: boolean;
  /** Shown to administrators only: a temporary lock after failed passwords, and until when. */
  locked?: boolean;
  lockedUntil?: string | null;
  /** Shown to administrators only: the person must choose a new password at next sign-in. */
  passwordChangeRequired?: boolean;
  mailDigest: boolean;
  version: number;
}
