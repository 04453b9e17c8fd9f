import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import {
  notificationPreferencesQueryKey,
  notificationPreferencesResponseSchema,
  type NotificationPreferences,
} from './notification-preferences.schema';

export async function updateNotificationPreferences(prefs: NotificationPreferences): Promise<NotificationPreferences> {
  const body = await apiRequest<unknown>('/api/me/notifications', { method: 'PUT', body: prefs });
  return notificationPreferencesResponseSchema.parse(body).notifications;
}

export function useUpdateNotificationPreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateNotificationPreferences,
    onSuccess: (saved) => queryClient.setQueryData(notificationPreferencesQueryKey, saved),
  });
}
