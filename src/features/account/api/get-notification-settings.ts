import { queryOptions, useQuery } from '@tanstack/react-query';
import { notificationSettingsSchema } from '../../../../shared/contracts/account.ts';
import { api } from '../../../lib/api-client.ts';

export function getNotificationSettings(signal?: AbortSignal) {
  return api.get('/api/me/notifications', { schema: notificationSettingsSchema, signal });
}

export const getNotificationSettingsQueryOptions = (userId: string) =>
  queryOptions({ queryKey: ['notification-settings', userId], queryFn: ({ signal }) => getNotificationSettings(signal) });

export function useNotificationSettings(userId: string) {
  return useQuery(getNotificationSettingsQueryOptions(userId));
}
