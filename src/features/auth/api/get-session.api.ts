import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, isApiError } from '../../../lib/api-client';
import { sessionSchema, type Session } from './session.schema';

export const sessionQueryKey = ['auth', 'session'] as const;

/** The signed-in session, or null when nobody is signed in (401 is an answer, not an error). */
export async function getSession(signal?: AbortSignal): Promise<Session | null> {
  try {
    return sessionSchema.parse(await api.get<unknown>('/api/session', signal));
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export function sessionQueryOptions() {
  return queryOptions({
    queryKey: sessionQueryKey,
    queryFn: ({ signal }) => getSession(signal),
    staleTime: 5 * 60_000,
  });
}

export function useSession() {
  return useQuery(sessionQueryOptions());
}
