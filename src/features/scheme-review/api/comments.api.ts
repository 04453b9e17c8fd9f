import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { commentSchema, reviewQueryKey } from './review.schema';

const listSchema = z.object({ comments: z.array(commentSchema) });
const oneSchema = z.object({ comment: commentSchema });

export function useSchemeComments(schemeId: string) {
  return useQuery({
    queryKey: reviewQueryKey(schemeId, 'comments'),
    queryFn: async ({ signal }) =>
      listSchema.parse(await api.get<unknown>(`/api/schemes/${encodeURIComponent(schemeId)}/comments`, signal)).comments,
  });
}

export function useAddComment(schemeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (body: string) =>
      oneSchema.parse(await api.post<unknown>(`/api/schemes/${encodeURIComponent(schemeId)}/comments`, { body })).comment,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: reviewQueryKey(schemeId, 'comments') }),
        queryClient.invalidateQueries({ queryKey: reviewQueryKey(schemeId, 'activity') }),
      ]),
  });
}
