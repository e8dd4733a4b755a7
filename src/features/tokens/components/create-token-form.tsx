import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { NumberField, TextField } from '../../../components/ui/text-field.tsx';
import { TOKEN_SCOPES, TOKEN_SCOPE_TEXT } from '../../../../shared/contracts/tokens.ts';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { useCreateToken } from '../api/create-token.ts';
import { tokenFormSchema } from './token-form-values.ts';


export interface CreatedToken {
  name: string;
  token: string;
}

/** Name a new token and, optionally, when it stops working. */
export function CreateTokenForm({ departmentId, userId, onCreated }: { departmentId: string; userId: string; onCreated: (token: CreatedToken) => void }) {
  const create = useCreateToken(departmentId, userId);
  const form = useSchemaForm(tokenFormSchema, async (body) => {
    const created = await create.mutateAsync(body);
    onCreated({ name: created.name, token: created.token });
  });
  return (
    <form {...form.formProps} aria-label="Create an API token">
      <fieldset disabled={form.submitting} className="grid items-start gap-4 sm:grid-cols-[minmax(0,1fr)_16rem]">
        <legend className="sr-only">New token</legend>
        <Alert message={form.formError} className="sm:col-span-2" />
        <TextField label="Name" name="name" autoComplete="off" hint="What the token is for: “laptop CLI”, “sweep script”." error={form.fieldErrors.name} />
        <NumberField label="Expires after" name="expiresInDays" unit="days" hint="1 to 3650; empty for never." error={form.fieldErrors.expiresInDays} />
        <Select
          label="Scope"
          name="scope"
          defaultValue="read"
          className="sm:col-span-2"
          options={TOKEN_SCOPES.map((scope) => ({ value: scope, label: TOKEN_SCOPE_TEXT[scope].label }))}
          hint={
            <>
              {TOKEN_SCOPES.map((scope) => (
                <span key={scope} className="block">
                  {TOKEN_SCOPE_TEXT[scope].label}: {TOKEN_SCOPE_TEXT[scope].allows}
                </span>
              ))}
              <span className="block">No token can create or revoke tokens, or manage members, billing or your account: those need you signed in. Choosing a new password revokes all your tokens.</span>
            </>
          }
          error={form.fieldErrors.scope}
        />
        <div className="sm:col-span-2">
          <Button type="submit" pending={form.submitting}>
            Create token
          </Button>
        </div>
      </fieldset>
    </form>
  );
}
