import { QueryClient } from '@tanstack/react-query';
import { describe, expect, it } from 'vitest';
import { invalidatePlanResults } from '../../src/lib/plan-change-queries';
import { comparisonQueryKey } from '../../src/features/tonnage/api/get-comparison.api';
import { scheduleQueryKey } from '../../src/features/schedule/api/get-schedule.api';
import { planSheetQueryKey } from '../../src/features/plan-sheet/api/get-plan-sheet.api';
import { revisionsQueryKey } from '../../src/features/schemes/api/get-revisions.api';
import { schemesQueryKey } from '../../src/features/schemes/api/get-schemes.api';
import { reviewQueryKey } from '../../src/features/scheme-review/api/review.schema';
import { editorSchemeQueryKey } from '../../src/features/editor/api/get-scheme.api';
import { underlaysQueryKey } from '../../src/features/underlay/api/get-underlays.api';

describe('invalidatePlanResults', () => {
  it('when a plan is saved, then Tonnage, Schedule, plan sheets, revisions, activity and the scheme list go stale; the editor copy, underlays and other schemes do not', async () => {
    const client = new QueryClient({ defaultOptions: { queries: { staleTime: 30_000 } } });
    const stale = [
      comparisonQueryKey('p1'),
      scheduleQueryKey('s1'),
      planSheetQueryKey('s1', 'L2', true),
      revisionsQueryKey('s1'),
      reviewQueryKey('s1', 'activity'),
      schemesQueryKey('p1'),
    ];
    const kept = [editorSchemeQueryKey('s1'), underlaysQueryKey('s1'), scheduleQueryKey('s2'), comparisonQueryKey('p2'), reviewQueryKey('s1', 'comments')];
    for (const key of [...stale, ...kept]) client.setQueryData(key, { cached: true });

    await invalidatePlanResults(client, 'p1', 's1');

    for (const key of stale) expect(client.getQueryState(key)?.isInvalidated, JSON.stringify(key)).toBe(true);
    for (const key of kept) expect(client.getQueryState(key)?.isInvalidated, JSON.stringify(key)).toBe(false);
  });
});
