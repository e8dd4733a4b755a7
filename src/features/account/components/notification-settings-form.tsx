import type { NotificationSettings } from '../../../../shared/contracts/account.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { ErrorState, errorMessage } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { useNotificationSettings } from '../api/get-notification-settings.ts';
import { useSaveNotificationSettings } from '../api/save-notification-settings.ts';

const OPTIONS: { key: keyof NotificationSettings; label: string; hint: string }[] = [
  { key: 'runFinished', label: 'When a run of mine finishes', hint: 'With the predicted magnetic fraction and a link to the result.' },
  { key: 'runFailed', label: 'When a run of mine fails', hint: 'With the error; its credit is given back either way.' },
];

/** Run notices by e-mail, each on or off; a change is saved at once. */
export function NotificationSettingsForm({ userId, email }: { userId: string; email: string }) {
  const settings = useNotificationSettings(userId);
  const save = useSaveNotificationSettings(userId);
  return (
    <Card title="E-mail notices" description={`Sent to ${email}. Invitations, password resets and receipts are always sent.`}>
      {settings.isPending ? (
        <LoadingState label="Loading your settings…" />
      ) : settings.isError ? (
        <ErrorState error={settings.error} title="Your settings could not be loaded" onRetry={() => void settings.refetch()} retrying={settings.isFetching} />
      ) : (
        <fieldset disabled={save.isPending} className="flex flex-col gap-4">
          <legend className="sr-only">Run notices</legend>
          {OPTIONS.map((option) => (
            <label key={option.key} className="flex cursor-pointer items-start gap-3">
              <input
                type="checkbox"
                className="mt-1 size-5 accent-lantern-400"
                checked={(save.isPending ? save.variables : settings.data)[option.key]}
                onChange={(event) => save.mutate({ ...settings.data, [option.key]: event.target.checked })}
              />
              <span>
                <span className="block font-bold text-foam-50">{option.label}</span>
                <span className="block text-foam-300">{option.hint}</span>
              </span>
            </label>
          ))}
          <Alert tone={save.isError ? 'danger' : 'success'} message={save.isError ? errorMessage(save.error) : save.isSuccess ? 'Saved.' : undefined} />
        </fieldset>
      )}
    </Card>
  );
}
