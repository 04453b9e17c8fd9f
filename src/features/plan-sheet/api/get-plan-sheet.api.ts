import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PlanSheet } from '../../../../shared/drafting/plan-sheet.drafting';

export interface PlanSheetsView {
  scheme: { id: string; name: string; revision: number };
  sheets: PlanSheet[];
  caution: string;
}

export const planSheetQueryKey = (schemeId: string, levelId: string, reactions: boolean) =>
  ['schemes', schemeId, 'plan-sheet', levelId, reactions] as const;

function query(levelId: string, reactions: boolean): string {
  const q = new URLSearchParams();
  if (levelId) q.set('level', levelId);
  if (reactions) q.set('reactions', '1');
  const s = q.toString();
  return s ? `?${s}` : '';
}

export function planSheetPdfHref(schemeId: string, levelId: string, reactions: boolean): string {
  return `/api/schemes/${encodeURIComponent(schemeId)}/plan-sheet.pdf${query(levelId, reactions)}`;
}

export function planSheetQueryOptions(schemeId: string, levelId: string, reactions: boolean) {
  return queryOptions({
    queryKey: planSheetQueryKey(schemeId, levelId, reactions),
    queryFn: ({ signal }) =>
      api.get<PlanSheetsView>(`/api/schemes/${encodeURIComponent(schemeId)}/plan-sheet${query(levelId, reactions)}`, signal),
  });
}

/** The sheet drawing model of one level (the same one the PDF is drawn from). */
export function usePlanSheet(schemeId: string, levelId: string, reactions: boolean) {
  return useQuery({ ...planSheetQueryOptions(schemeId, levelId, reactions), enabled: schemeId !== '' && levelId !== '' });
}
