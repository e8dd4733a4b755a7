import { passwordResetRequestSchema } from '../../../../shared/contracts/account.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { useRequestPasswordReset } from '../api/request-password-reset.ts';

/** Asks for a reset link; the answer does not say whether the address has an account. */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const form = useSchemaForm(passwordResetRequestSchema, (values) => request.mutateAsync(values));
  if (request.isSuccess) return <Alert tone="success" message={request.data.message} />;
  return (
    <form {...form.formProps} className="flex flex-col gap-5" aria-label="Reset your password">
      <Alert message={form.formError} />
      <TextField label="E-mail" name="email" type="email" autoComplete="username" inputMode="email" spellCheck={false} required error={form.fieldErrors.email} />
      <Button type="submit" pending={form.submitting} className="w-full">
        Send a reset link
      </Button>
    </form>
  );
}
