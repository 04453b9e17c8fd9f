import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import {
  notificationPreferencesQueryKey,
  notificationPreferencesResponseSchema,
  type NotificationPreferences,
} from './notification-preferences.schema';

export async function getNotificationPreferences(signal?: AbortSignal): Promise<NotificationPreferences> {
  const body = await api.get<unknown>('/api/me/notifications', signal);
  return notificationPreferencesResponseSchema.parse(body).notifications;
}

export function notificationPreferencesQueryOptions() {
  return queryOptions({
    queryKey: notificationPreferencesQueryKey,
    queryFn: ({ signal }) => getNotificationPreferences(signal),
    staleTime: 0,
  });
}

export function useNotificationPreferences() {
  return useQuery(notificationPreferencesQueryOptions());
}
