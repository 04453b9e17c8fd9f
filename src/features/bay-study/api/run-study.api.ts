import { api } from '../../../lib/api-client';
import type { StudyResult } from '../../../../shared/engine/index';

// POST /api/schemes/:id/studies: the server runs the study on the saved plan and keeps it.

export interface StoredStudy {
  id: string;
  schemeId: string;
  revision: number;
  stale: boolean;
  optionCount: number;
  result: StudyResult;
}

/** The request without prices (the server prices with the firm's) and the revision studied. */
export async function runStoredStudy(schemeId: string, request: Record<string, unknown>, revision: number): Promise<StoredStudy> {
  const body = await api.post<{ study: StoredStudy }>(`/api/schemes/${encodeURIComponent(schemeId)}/studies`, { ...request, revision });
  return body.study;
}
