import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import type { Role } from '../../../lib/permissions';
import { teamQueryKey } from './get-team.api';
import { teamMemberSchema, type TeamMember } from './team.schema';

export async function changeRole(userId: string, role: Role): Promise<TeamMember> {
  const body = await api.patch<unknown>(`/api/team/${encodeURIComponent(userId)}`, { role });
  return z.object({ member: teamMemberSchema }).parse(body).member;
}

export function useChangeRole() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: Role }) => changeRole(userId, role),
    onSettled: () => queryClient.invalidateQueries({ queryKey: teamQueryKey }),
  });
}
