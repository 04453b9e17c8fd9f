import { QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it, vi } from 'vitest';
import { useDeleteScheme } from '../../src/features/schemes/api/delete-scheme.api';
import { schemesQueryKey } from '../../src/features/schemes/api/get-schemes.api';
import { useRestoreRevision } from '../../src/features/schemes/api/restore-revision.api';
import { comparisonQueryKey } from '../../src/features/tonnage/api/get-comparison.api';
import { scheduleQueryKey } from '../../src/features/schedule/api/get-schedule.api';
import { jsonResponse, testQueryClient, testSession } from '../../src/testing/test-utils';

function setup() {
  const client = testQueryClient(testSession('engineer'));
  for (const key of [schemesQueryKey('p1'), comparisonQueryKey('p1'), scheduleQueryKey('s1'), comparisonQueryKey('p2')]) client.setQueryData(key, { cached: true });
  const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={client}>{children}</QueryClientProvider>;
  return { client, wrapper };
}

describe('scheme mutations refresh Tonnage', () => {
  it('when a scheme is deleted, then the scheme list and the project Tonnage comparison go stale, not another project', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => jsonResponse(204, null)));
    const { client, wrapper } = setup();
    const { result } = renderHook(() => useDeleteScheme('p1'), { wrapper });
    act(() => result.current.mutate('s1'));
    await waitFor(() => expect(result.current.isSuccess).toBe(true));
    expect(client.getQueryState(schemesQueryKey('p1'))?.isInvalidated).toBe(true);
    expect(client.getQueryState(comparisonQueryKey('p1'))?.isInvalidated).toBe(true);
    expect(client.getQueryState(comparisonQueryKey('p2'))?.isInvalidated).toBe(false);
  });

  it('when a revision is restored, then Tonnage and the Schedule of that scheme go stale', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => jsonResponse(200, { scheme: { revision: 7 }, restoredFrom: 3 })));
    const { client, wrapper } = setup();
    const { result } = renderHook(() => useRestoreRevision('p1', 's1'), { wrapper });
    act(() => result.current.mutate(3));
    await waitFor(() => expect(result.current.isSuccess).toBe(true));
    expect(client.getQueryState(comparisonQueryKey('p1'))?.isInvalidated).toBe(true);
    expect(client.getQueryState(scheduleQueryKey('s1'))?.isInvalidated).toBe(true);
  });
});
