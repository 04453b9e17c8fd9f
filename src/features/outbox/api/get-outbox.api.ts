import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';

export const outboxMessageSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  sentAt: z.string(),
});
export type OutboxMessage = z.output<typeof outboxMessageSchema>;

export const outboxQueryKey = ['outbox'] as const;

export async function getOutbox(signal?: AbortSignal): Promise<OutboxMessage[]> {
  const body = await api.get<unknown>('/api/outbox', signal);
  return z.object({ messages: z.array(outboxMessageSchema) }).parse(body).messages;
}

/** 404 means mail goes out through an SMTP server and nothing is kept: not retried. */
export function outboxQueryOptions() {
  return queryOptions({ queryKey: outboxQueryKey, queryFn: ({ signal }) => getOutbox(signal), retry: false, staleTime: 0 });
}

export function useOutbox() {
  return useQuery(outboxQueryOptions());
}
