import { z } from 'zod';

export const AreaCreateSchema = z
  .object({
    code: z.string().trim().min(1).max(16).regex(/^[A-Z0-9-]+$/, 'use capital letters, digits and dashes'),
    name: z.string().trim().min(1, 'enter the area name').max(120),
    leadUserId: z.number().int().positive().nullable().default(null),
  })
  .strict();

export const AreaUpdateSchema = AreaCreateSchema.partial().strict();

export interface AreaView {
  id: number;
  code: string;
  name: string;
  leadUserId: number | null;
  leadName: string | null;
}
