import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { teamMemberSchema, type TeamMember } from './team.schema';

export const teamQueryKey = ['team'] as const;

const teamResponseSchema = z.object({ members: z.array(teamMemberSchema) });

export async function getTeam(signal?: AbortSignal): Promise<TeamMember[]> {
  return teamResponseSchema.parse(await api.get<unknown>('/api/team', signal)).members;
}

export function teamQueryOptions() {
  return queryOptions({ queryKey: teamQueryKey, queryFn: ({ signal }) => getTeam(signal), staleTime: 0 });
}

export function useTeam() {
  return useQuery(teamQueryOptions());
}
