// useMutation that sends one request at a time. A double click fires two click
// events before React has re-rendered the button as disabled (TanStack Query
// notifies its observers on a later tick), so the guard is a ref set
// synchronously on the first call: a second call while the first is in flight
// sends nothing (mutate) or joins the first (mutateAsync).
import { useMutation as useTanstackMutation, type DefaultError, type UseMutationOptions, type UseMutationResult } from '@tanstack/react-query';
import { useCallback, useMemo, useRef } from 'react';

export function useMutation<TData = unknown, TError = DefaultError, TVariables = void, TContext = unknown>(
  options: UseMutationOptions<TData, TError, TVariables, TContext>,
): UseMutationResult<TData, TError, TVariables, TContext> {
  const mutation = useTanstackMutation(options);
  const inFlight = useRef<Promise<TData> | null>(null);
  const { mutateAsync: rawMutateAsync } = mutation;

  type Result = UseMutationResult<TData, TError, TVariables, TContext>;
  const mutateAsync = useCallback(
    (...args: Parameters<Result['mutateAsync']>) => {
      if (inFlight.current) return inFlight.current;
      const promise = rawMutateAsync(...args).finally(() => {
        inFlight.current = null;
      });
      inFlight.current = promise;
      return promise;
    },
    [rawMutateAsync],
  );
  const mutate = useCallback(
    (...args: Parameters<Result['mutate']>) => {
      if (inFlight.current) return;
      // mutate never rejects: the error is in mutation.error and the caller's onError.
      mutateAsync(...(args as Parameters<Result['mutateAsync']>)).catch(() => undefined);
    },
    [mutateAsync],
  );
  return useMemo(() => ({ ...mutation, mutate, mutateAsync }) as Result, [mutation, mutate, mutateAsync]);
}
