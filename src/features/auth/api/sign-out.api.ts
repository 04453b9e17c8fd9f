import { useMutation } from '@tanstack/react-query';
import { paths } from '../../../config/paths';
import { api } from '../../../lib/api-client';

export async function signOut(): Promise<void> {
  await api.delete('/api/session');
}

/**
 * Signs out, then loads the sign-in page afresh: a full page load drops every cached answer
 * of the person who left, so nothing of theirs stays in this tab's memory.
 */
export function useSignOut(leave: () => void = () => window.location.replace(paths.signIn.href())) {
  return useMutation({ mutationFn: signOut, onSuccess: leave });
}
