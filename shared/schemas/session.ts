import { z } from 'zod';

export const SignInSchema = z
  .object({
    email: z.string().trim().toLowerCase().email('enter the e-mail address you sign in with').max(254),
    password: z.string().min(1, 'enter your password').max(1024),
  })
  .strict();

export type SignInInput = z.infer<typeof SignInSchema>;
