import type { QueryClient } from '@tanstack/react-query';

/**
 * After a scheme's plan is saved (or its stored design is redone), the results read from it
 * elsewhere are out of date: the project's Tonnage comparison, the scheme's Schedule and plan
 * sheets, its revisions and its activity. Marks them stale so the next screen that shows them
 * fetches again instead of serving the copy cached before the change. Keys are spelled as
 * prefixes here because features do not import each other.
 */
export function invalidatePlanResults(queryClient: QueryClient, projectId: string, schemeId: string): Promise<void[]> {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: ['projects', projectId, 'schemes'] }),
    queryClient.invalidateQueries({ queryKey: ['projects', projectId, 'comparison'] }),
    queryClient.invalidateQueries({ queryKey: ['schemes', schemeId, 'schedule'] }),
    queryClient.invalidateQueries({ queryKey: ['schemes', schemeId, 'plan-sheet'] }),
    queryClient.invalidateQueries({ queryKey: ['schemes', schemeId, 'revisions'] }),
    queryClient.invalidateQueries({ queryKey: ['schemes', schemeId, 'activity'] }),
  ]);
}
