import { z } from 'zod';
import { PASSWORD_MIN_LENGTH, passwordSchema } from '../../../../shared/contracts/auth.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { useResetPassword } from '../api/reset-password.ts';

const newPasswordSchema = z.strictObject({ password: passwordSchema });

/** Sets a new password with the token of the e-mailed link. */
export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const reset = useResetPassword();
  const form = useSchemaForm(newPasswordSchema, async ({ password }) => {
    await reset.mutateAsync({ token, password });
    onDone();
  });
  if (!token) return <Alert message="This page needs the link from the reset e-mail; open that link again or ask for a new one." />;
  return (
    <form {...form.formProps} className="flex flex-col gap-5" aria-label="Choose a new password">
      <Alert message={form.formError} />
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. Other sessions of your account end when it changes.`}
        required
        error={form.fieldErrors.password}
      />
      <Button type="submit" pending={form.submitting} className="w-full">
        Set the new password
      </Button>
    </form>
  );
}
