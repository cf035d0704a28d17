import type { Request } from 'express';
import type { z } from 'zod';
import { AppError } from './app-error';
import { invalidInputMessage, zodIssuesToDetails } from '../middlewares/error-handler';
import { illFormedTextError } from '../middlewares/text-input';
import { findIllFormedText } from '../../shared/schemas/common';

function parseWith<S extends z.ZodType>(schema: S, value: unknown, where: string): z.infer<S> {
  // Multipart fields and query values do not pass the JSON body check in app.ts.
  const broken = findIllFormedText(value);
  if (broken) throw illFormedTextError(broken);
  const result = schema.safeParse(value);
  if (!result.success) {
    const details = zodIssuesToDetails(result.error);
    throw new AppError(invalidInputMessage(details, where), { status: 400, code: 'invalid_input', details });
  }
  return result.data;
}

export const parseBody = <S extends z.ZodType>(schema: S, req: Request) => parseWith(schema, req.body ?? {}, 'body');
export const parseQuery = <S extends z.ZodType>(schema: S, req: Request) => parseWith(schema, { ...req.query }, 'query');
export const parseParams = <S extends z.ZodType>(schema: S, req: Request) => parseWith(schema, { ...req.params }, 'path');
