import { z } from 'zod';

/** The signed-in person's own e-mail settings, as /api/me/notifications reads and writes them. */
export const notificationPreferencesSchema = z.object({
  schemeSubmitted: z.boolean(),
  schemeChosen: z.boolean(),
});

export type NotificationPreferences = z.output<typeof notificationPreferencesSchema>;

export const notificationPreferencesResponseSchema = z.object({ notifications: notificationPreferencesSchema });

export const notificationPreferencesQueryKey = ['me', 'notifications'] as const;
