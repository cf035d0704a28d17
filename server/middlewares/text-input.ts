// Refuses a request whose JSON body carries ill-formed UTF-16 (a lone
// surrogate) before any route sees it: one 400 for every route, so such text
// never reaches a service, the database or the trail.
import type { RequestHandler } from 'express';
import { AppError } from '../lib/app-error';
import { findIllFormedText, ILL_FORMED_TEXT_MESSAGE } from '../../shared/schemas/common';

export function illFormedTextError(path: string): AppError {
  return new AppError('Some fields contain broken characters', {
    status: 400,
    code: 'invalid_input',
    details: [{ path, message: ILL_FORMED_TEXT_MESSAGE }],
  });
}

export const refuseIllFormedText: RequestHandler = (req, _res, next) => {
  const path = findIllFormedText(req.body);
  next(path ? illFormedTextError(path) : undefined);
};
