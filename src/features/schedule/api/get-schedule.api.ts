import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ScheduleBasis, ScheduleRow } from '../../../../shared/drafting/schedule.drafting';
import type { ColumnSchedule } from '../../../../shared/drafting/column-schedule.drafting';

export interface ScheduleView {
  scheme: { id: string; projectId: string; name: string; revision: number };
  design: { revision: number; designedAt: string };
  basis: ScheduleBasis;
  levels: { id: string; name: string; elevation_ft: number }[];
  rows: ScheduleRow[];
  problems: { message: string; elementId?: string }[];
  caution: string;
  compositeNote: string | null;
  /** Absent from a server older than the column schedule. */
  columnSchedule?: ColumnSchedule;
}

export const scheduleQueryKey = (schemeId: string) => ['schemes', schemeId, 'schedule'] as const;

export async function getSchedule(schemeId: string, signal?: AbortSignal): Promise<ScheduleView> {
  return api.get<ScheduleView>(`/api/schemes/${encodeURIComponent(schemeId)}/schedule`, signal);
}

export function scheduleQueryOptions(schemeId: string) {
  return queryOptions({ queryKey: scheduleQueryKey(schemeId), queryFn: ({ signal }) => getSchedule(schemeId, signal) });
}

/** The schedule of a scheme (the server designs it first when its design is stale). */
export function useSchedule(schemeId: string) {
  return useQuery({ ...scheduleQueryOptions(schemeId), enabled: schemeId !== '' });
}

/** Where the CSV and PDF downloads live (plain links: the browser saves the attachment). */
export const exportLinks = (schemeId: string) => ({
  csv: `/api/schemes/${encodeURIComponent(schemeId)}/schedule.csv`,
  pdf: `/api/schemes/${encodeURIComponent(schemeId)}/plan-sheet.pdf`,
  calcBook: `/api/schemes/${encodeURIComponent(schemeId)}/calc-book.pdf`,
  /** The framing as an IFC4 model (ISO 16739) for building-model software. */
  ifc: `/api/schemes/${encodeURIComponent(schemeId)}/model.ifc`,
});
