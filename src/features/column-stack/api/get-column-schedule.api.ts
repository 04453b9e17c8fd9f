import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ColumnSchedule } from '../../../../shared/drafting/column-schedule.drafting';

/**
 * The column schedule comes with the scheme's schedule (GET /api/schemes/:id/schedule, built by
 * shared/drafting/column-schedule.drafting.ts): one source for the Schedule page and the Column
 * stack. The same query key, so both screens share the cached copy and its invalidation.
 */
export interface ColumnStackView {
  scheme: { id: string; projectId: string; name: string; revision: number };
  design: { revision: number; designedAt: string };
  levels: { id: string; name: string; elevation_ft: number }[];
  problems: { message: string; elementId?: string }[];
  caution: string;
  columnSchedule?: ColumnSchedule;
}

export const columnScheduleQueryKey = (schemeId: string) => ['schemes', schemeId, 'schedule'] as const;

export async function getColumnSchedule(schemeId: string, signal?: AbortSignal): Promise<ColumnStackView> {
  return api.get<ColumnStackView>(`/api/schemes/${encodeURIComponent(schemeId)}/schedule`, signal);
}

export function useColumnSchedule(schemeId: string) {
  return useQuery({
    ...queryOptions({ queryKey: columnScheduleQueryKey(schemeId), queryFn: ({ signal }) => getColumnSchedule(schemeId, signal) }),
    enabled: schemeId !== '',
  });
}
