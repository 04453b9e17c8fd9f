import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, apiRequest, ApiError } from '../../../lib/api-client';
import { exportPlanFile, parsePlanFile, type Plan } from '../../../../shared/schemas/plan.schema';
import { invalidatePlanResults } from '../../../lib/plan-change-queries';
import { applyColumnEdit, type ColumnEdit } from '../lib/column-edits';

/**
 * A column edit from the Column stack (splice levels, allowed series, a locked tier size) goes
 * through the plan save every other edit uses (PUT /api/schemes/:id/plan, 'plan:write': owner
 * and engineer, enforced by the server), then the stored design is redone so the schedule
 * follows. The plan is read fresh and saved with its revision, so a concurrent change is a
 * 409 the user is told about, never overwritten.
 */
export async function saveColumnEdit(schemeId: string, edit: ColumnEdit): Promise<{ revision: number }> {
  const path = `/api/schemes/${encodeURIComponent(schemeId)}`;
  const body = await api.get<{ scheme: { revision: number; plan: unknown } }>(path);
  const { plan } = parsePlanFile(body.scheme.plan);
  if (!plan) throw new ApiError(422, 'plan_unreadable', 'The plan of this scheme could not be read; open it on the Plan to repair it.');
  const next: Plan = applyColumnEdit(plan, edit);
  const saved = await apiRequest<{ revision: number }>(`${path}/plan`, { method: 'PUT', body: { revision: body.scheme.revision, plan: exportPlanFile(next) } });
  await api.post(`${path}/design`);
  return { revision: saved.revision };
}

export function useSaveColumnEdit(projectId: string, schemeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (edit: ColumnEdit) => saveColumnEdit(schemeId, edit),
    onSettled: () =>
      Promise.all([
        invalidatePlanResults(queryClient, projectId, schemeId),
        // The Plan's copy of the scheme (spelled as a prefix: features do not import each other).
        queryClient.invalidateQueries({ queryKey: ['editor', 'scheme', schemeId] }),
      ]),
  });
}
