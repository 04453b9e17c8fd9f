import { QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it, vi } from 'vitest';
import { useSignOut } from '../../src/features/auth/api/sign-out.api';
import { jsonResponse, testQueryClient, testSession } from '../../src/testing/test-utils';

describe('useSignOut', () => {
  it('when signing out succeeds, then it sends DELETE /api/session and then leaves', async () => {
    const fetchMock = vi.fn(async () => jsonResponse(204, null));
    vi.stubGlobal('fetch', fetchMock);
    const leave = vi.fn();
    const client = testQueryClient(testSession('engineer'));
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={client}>{children}</QueryClientProvider>;
    const { result } = renderHook(() => useSignOut(leave), { wrapper });

    act(() => result.current.mutate());

    await waitFor(() => expect(leave).toHaveBeenCalledTimes(1));
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/session');
    expect(init.method).toBe('DELETE');
  });

  it('when the server cannot be reached, then it stays and reports a network error', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    const leave = vi.fn();
    const client = testQueryClient(testSession('engineer'));
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={client}>{children}</QueryClientProvider>;
    const { result } = renderHook(() => useSignOut(leave), { wrapper });

    act(() => result.current.mutate());

    await waitFor(() => expect(result.current.isError).toBe(true));
    expect(result.current.error).toMatchObject({ code: 'network', status: 0 });
    expect(leave).not.toHaveBeenCalled();
  });
});
