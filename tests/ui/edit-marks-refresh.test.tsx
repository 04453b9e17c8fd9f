import { QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it, vi } from 'vitest';
import { useEditMarks, useRenumberMarks } from '../../src/features/schedule/api/edit-marks.api';
import { scheduleQueryKey } from '../../src/features/schedule/api/get-schedule.api';
import { editorSchemeQueryKey } from '../../src/features/editor/api/get-scheme.api';
import { jsonResponse, testQueryClient, testSession } from '../../src/testing/test-utils';

function setup() {
  const client = testQueryClient(testSession('engineer'));
  client.setQueryData(editorSchemeQueryKey('s1'), { revision: 3 });
  client.setQueryData(editorSchemeQueryKey('s2'), { revision: 9 });
  client.setQueryData(scheduleQueryKey('s1'), { revision: 3 });
  const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={client}>{children}</QueryClientProvider>;
  return { client, wrapper };
}

describe('editing marks refreshes the Plan copy', () => {
  it('when a mark is saved (a new revision), then the Plan page copy of that scheme is dropped and the schedule goes stale; another scheme is kept', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => jsonResponse(200, { revision: 4, changed: true, marks: [] })));
    const { client, wrapper } = setup();
    const { result } = renderHook(() => useEditMarks('s1'), { wrapper });
    act(() => result.current.mutate({ revision: 3, marks: [{ memberId: 'b1', mark: 'QA1' }] }));
    await waitFor(() => expect(result.current.isSuccess).toBe(true));
    await waitFor(() => expect(client.getQueryData(editorSchemeQueryKey('s1'))).toBeUndefined());
    expect(client.getQueryState(scheduleQueryKey('s1'))?.isInvalidated).toBe(true);
    expect(client.getQueryData(editorSchemeQueryKey('s2'))).toEqual({ revision: 9 });
  });

  it('when marks are renumbered, then the Plan page copy of that scheme is dropped too', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => jsonResponse(200, { revision: 4, changed: true, marks: [] })));
    const { client, wrapper } = setup();
    const { result } = renderHook(() => useRenumberMarks('s1'), { wrapper });
    act(() => result.current.mutate({ keepManual: true }));
    await waitFor(() => expect(result.current.isSuccess).toBe(true));
    await waitFor(() => expect(client.getQueryData(editorSchemeQueryKey('s1'))).toBeUndefined());
  });
});
