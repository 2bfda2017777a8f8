import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { alertSettingsKey } from './alert-keys';
import type { AlertSettings } from './get-alert-settings';

export function updateAlertSettings(body: AlertSettings): Promise<AlertSettings> {
  return apiFetch<AlertSettings>('/api/v1/alert-settings', { method: 'PUT', body });
}

export function useUpdateAlertSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateAlertSettings,
    onSuccess: (saved) => queryClient.setQueryData(alertSettingsKey, saved),
  });
}
