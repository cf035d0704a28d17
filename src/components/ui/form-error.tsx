import { ApiError } from '../../lib/api-client';
import { formErrors } from '../../lib/field-errors';
import { ErrorNotice } from './states';

/**
 * Below a form: what its fields do not already show. Messages that landed on
 * fields are only pointed to; a message for a path the form has no field for is
 * said with its label; any other error is said as it is.
 */
export function FormErrorNotice({ error, fields, title = 'Not saved' }: { error: unknown; fields: Record<string, string>; title?: string }) {
  if (!error) return null;
  if (!(error instanceof ApiError) || error.fieldErrors.length === 0) return <ErrorNotice error={error} title={title} />;
  const { unplaced, hasFieldErrors } = formErrors(error, fields);
  return (
    <div role="alert" className="rounded-md border border-fail/30 bg-red-50 px-3 py-2 text-sm text-fail">
      <strong className="font-bold">{title}.</strong> {hasFieldErrors ? 'Correct the fields marked above.' : ''} {unplaced.join('; ')}
    </div>
  );
}
