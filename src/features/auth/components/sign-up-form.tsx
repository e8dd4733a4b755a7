import { PASSWORD_MIN_LENGTH, signUpBodySchema } from '../../../../shared/contracts/auth.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { useSignUp } from '../api/sign-up.ts';

/** Asks for an account; afterwards it shows the server's "check your mail" answer in its place. */
export function SignUpForm() {
  const signUp = useSignUp();
  const form = useSchemaForm(signUpBodySchema, async (values) => {
    await signUp.mutateAsync(values);
  });

  if (signUp.isSuccess) {
    return (
      <div className="flex flex-col gap-3" role="status" aria-label="Check your mail">
        <Alert tone="success" message={signUp.data.message} />
        {signUp.data.localMailbox ? (
          <p className="text-sm text-foam-300">
            This Tidefield keeps its e-mail on this machine (the local mail stand-in): the message is in{' '}
            <a href={signUp.data.localMailbox} target="_blank" rel="noreferrer">
              {signUp.data.localMailbox}
            </a>
            .
          </p>
        ) : (
          <p className="text-sm text-foam-300">No mail after a few minutes? Look in the spam folder, or ask again with the same address.</p>
        )}
      </div>
    );
  }

  return (
    <form {...form.formProps} className="flex flex-col gap-5" aria-label="Create an account">
      <Alert message={form.formError} />
      <TextField label="Name" name="name" autoComplete="name" required error={form.fieldErrors.name} />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        inputMode="email"
        spellCheck={false}
        required
        error={form.fieldErrors.email}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words make a good one.`}
        required
        error={form.fieldErrors.password}
      />
      <TextField
        label="Department"
        name="department"
        autoComplete="organization"
        hint="A new department of this name is created, with you as its admin."
        required
        error={form.fieldErrors.department}
      />
      <Button type="submit" pending={form.submitting} className="w-full">
        Create account
      </Button>
    </form>
  );
}
