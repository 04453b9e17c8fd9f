import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ApiError } from '../../../lib/api-client';
import { underlaysQueryKey } from './get-underlays.api';
import { underlaySchema, type Underlay } from './underlay.schema';

const responseSchema = z.object({ underlay: underlaySchema });

/** POST multipart (file, level). The JSON api client cannot send files, so this uses fetch directly. */
export async function uploadUnderlay(schemeId: string, levelId: string, file: File): Promise<Underlay> {
  const form = new FormData();
  form.append('level', levelId);
  form.append('file', file, file.name);
  let response: Response;
  try {
    response = await fetch(`/api/schemes/${encodeURIComponent(schemeId)}/underlays`, {
      method: 'POST',
      body: form,
      headers: { Accept: 'application/json' },
      credentials: 'same-origin',
    });
  } catch {
    throw new ApiError(0, 'network', 'Could not reach the Baywright server. Check your connection.');
  }
  let payload: unknown;
  try {
    payload = await response.json();
  } catch {
    payload = undefined;
  }
  if (!response.ok) {
    const error = (payload as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | undefined)?.error;
    const fallback = response.status === 413 ? 'The image is larger than 10 MB.' : `The server answered ${response.status}. Try again.`;
    throw new ApiError(response.status, error?.code ?? `http_${response.status}`, error?.message ?? fallback, error?.fields);
  }
  return responseSchema.parse(payload).underlay;
}

export function useUploadUnderlay(schemeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ levelId, file }: { levelId: string; file: File }) => uploadUnderlay(schemeId, levelId, file),
    onSuccess: (created) => {
      queryClient.setQueryData<Underlay[]>(underlaysQueryKey(schemeId), (list) => [...(list ?? []), created]);
    },
  });
}
