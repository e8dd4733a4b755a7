import { useMutation, useQueryClient } from '@tanstack/react-query';
import { notificationSettingsSchema, type NotificationSettings } from '../../../../shared/contracts/account.ts';
import { api } from '../../../lib/api-client.ts';
import { getNotificationSettingsQueryOptions } from './get-notification-settings.ts';

export function saveNotificationSettings(body: NotificationSettings) {
  return api.put('/api/me/notifications', { body, schema: notificationSettingsSchema });
}

export function useSaveNotificationSettings(userId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveNotificationSettings,
    onSuccess: (settings) => queryClient.setQueryData(getNotificationSettingsQueryOptions(userId).queryKey, settings),
  });
}
