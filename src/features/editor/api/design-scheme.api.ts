import { api } from '../../../lib/api-client';

export interface StoredDesignSummary {
  revision: number;
  designedAt: string;
}

/** Ask the server to design the saved plan so the stored results follow the drawing. */
export async function designStoredScheme(schemeId: string): Promise<StoredDesignSummary> {
  const body = await api.post<{ revision?: number; designedAt?: string }>(`/api/schemes/${encodeURIComponent(schemeId)}/design`);
  return { revision: body?.revision ?? -1, designedAt: body?.designedAt ?? '' };
}
