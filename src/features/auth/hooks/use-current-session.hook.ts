import { useSession } from '../api/get-session.api';
import type { Session } from '../api/session.schema';

/** The session inside the signed-in shell, which renders nothing until it has one. */
export function useCurrentSession(): Session {
  const { data } = useSession();
  if (!data) throw new Error('useCurrentSession used outside the signed-in shell');
  return data;
}
