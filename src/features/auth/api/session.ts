import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api, ApiError, setCsrfToken } from '../../../lib/api-client';
import type { SessionResponse } from '../../../../shared/types/session';
import type { SignInInput } from '../../../../shared/schemas/session';
import type { PasswordChangeInput } from '../../../../shared/schemas/user';

export const sessionQueryKey = ['session'] as const;

async function fetchSession(): Promise<SessionResponse | null> {
  try {
    const session = await api.get<SessionResponse>('/session');
    setCsrfToken(session.csrfToken);
    return session;
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) {
      setCsrfToken(null);
      return null;
    }
    throw error;
  }
}

export const getSessionQueryOptions = () =>
  queryOptions({ queryKey: sessionQueryKey, queryFn: fetchSession, staleTime: 60_000 });

export const useSession = () => useQuery(getSessionQueryOptions());

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => api.post<SessionResponse>('/session', input),
    onSuccess: (session) => {
      setCsrfToken(session.csrfToken);
      queryClient.clear();
      queryClient.setQueryData(sessionQueryKey, session);
    },
  });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete<void>('/session'),
    onSettled: () => {
      setCsrfToken(null);
      queryClient.clear();
      queryClient.setQueryData(sessionQueryKey, null);
    },
  });
}

/** A person choosing their own password; their other sessions end on the server. */
export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PasswordChangeInput) => api.post<SessionResponse>('/session/password', input),
    onSuccess: (session) => {
      setCsrfToken(session.csrfToken);
      queryClient.setQueryData(sessionQueryKey, session);
    },
  });
}
