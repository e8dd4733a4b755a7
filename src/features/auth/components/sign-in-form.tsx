import { signInBodySchema } from '../../../../shared/contracts/auth.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { useSignIn } from '../api/sign-in.ts';

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const form = useSchemaForm(signInBodySchema, async (values) => {
    await signIn.mutateAsync(values);
    onSignedIn();
  });

  return (
    <form {...form.formProps} className="flex flex-col gap-5" aria-label="Sign in">
      <Alert message={form.formError} />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="username"
        inputMode="email"
        spellCheck={false}
        required
        error={form.fieldErrors.email}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        required
        error={form.fieldErrors.password}
      />
      <Button type="submit" pending={form.submitting} className="w-full">
        Sign in
      </Button>
    </form>
  );
}
