import { Button } from '../../../components/ui/button.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { useSignOut } from '../api/sign-out.ts';

export function SignOutButton({ onSignedOut }: { onSignedOut: () => void }) {
  const signOut = useSignOut();
  return (
    <div className="flex flex-col items-start gap-2">
      <Button variant="secondary" size="sm" pending={signOut.isPending} onClick={() => signOut.mutate(undefined, { onSuccess: onSignedOut })}>
        Sign out
      </Button>
      {signOut.isError && (
        <p role="alert" className="text-sm text-coral-300">
          {errorMessage(signOut.error)}
        </p>
      )}
    </div>
  );
}
