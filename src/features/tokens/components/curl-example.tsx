import { CopyButton } from '../../../components/ui/copy-button.tsx';
import { curlExample } from './token-text.ts';

const PLACEHOLDER = 'tfk_…';

/** A command that lists the department's runs with the token; with no token, a placeholder to replace. */
export function CurlExample({ token }: { token?: string }) {
  const command = curlExample(window.location.origin, token ?? PLACEHOLDER);
  return (
    <div className="mt-2 flex flex-col gap-2">
      <pre tabIndex={0} aria-label="Example command" className="overflow-x-auto rounded-md border border-ink-700 bg-ink-900 p-3 font-mono text-sm text-foam-50">
        <code>{command}</code>
      </pre>
      <p className="text-sm text-foam-400">
        Every route of the API accepts the token in place of signing in, acting for you in this department with your role. The full list of routes is at{' '}
        <a href="/api/openapi.json">/api/openapi.json</a>.
      </p>
      {token && (
        <div>
          <CopyButton text={command} label="Copy the command" />
        </div>
      )}
    </div>
  );
}
