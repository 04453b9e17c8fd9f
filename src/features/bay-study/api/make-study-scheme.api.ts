import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { runStoredStudy } from './run-study.api';

// POST /api/schemes/:id/studies/:studyId/schemes: a new scheme, the plan with the option applied.

export interface MadeScheme {
  scheme: { id: string; name: string; projectId: string };
  option: { id: string };
}

export async function makeStudyScheme(schemeId: string, studyId: string, optionId: string): Promise<MadeScheme> {
  return api.post<MadeScheme>(`/api/schemes/${encodeURIComponent(schemeId)}/studies/${encodeURIComponent(studyId)}/schemes`, { optionId });
}

/** Keeps the study on the server (for the saved revision), then makes the option a scheme. */
export function useMakeStudyScheme(projectId: string, schemeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: { request: Record<string, unknown>; revision: number; optionId: string }) => {
      const study = await runStoredStudy(schemeId, input.request, input.revision);
      return makeStudyScheme(schemeId, study.id, input.optionId);
    },
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: ['projects', projectId, 'schemes'] }),
        queryClient.invalidateQueries({ queryKey: ['projects', projectId, 'comparison'] }),
      ]),
  });
}
