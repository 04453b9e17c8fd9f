import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';

export const auditEventSchema = z.object({
  id: z.string(),
  userId: z.string().nullable(),
  actor: z.string().nullable(),
  action: z.string(),
  target: z.string().nullable(),
  detail: z.record(z.string(), z.unknown()).nullable(),
  createdAt: z.string(),
});
export type AuditEvent = z.output<typeof auditEventSchema>;

export interface AuditFilters {
  action?: string;
  userId?: string;
  from?: string;
  to?: string;
  limit?: number;
}

export const auditQueryKey = (filters: AuditFilters) => ['audit', filters] as const;

export function auditSearch(filters: AuditFilters): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) {
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  const query = params.toString();
  return query ? `?${query}` : '';
}

export async function getAudit(filters: AuditFilters, signal?: AbortSignal): Promise<AuditEvent[]> {
  const body = await api.get<unknown>(`/api/audit${auditSearch(filters)}`, signal);
  return z.object({ events: z.array(auditEventSchema) }).parse(body).events;
}

export function auditQueryOptions(filters: AuditFilters) {
  return queryOptions({
    queryKey: auditQueryKey(filters),
    queryFn: ({ signal }) => getAudit(filters, signal),
    placeholderData: keepPreviousData,
    staleTime: 0,
  });
}

export function useAudit(filters: AuditFilters) {
  return useQuery(auditQueryOptions(filters));
}
