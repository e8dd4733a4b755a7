import { useEffect, useRef } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { AlertIcon } from '../../../components/ui/icons.tsx';
import { CopyButton } from '../../../components/ui/copy-button.tsx';
import type { CreatedToken } from './create-token-form.tsx';
import { CurlExample } from './curl-example.tsx';

/**
 * The secret of a token just created, shown this once: the server keeps only its hash. Focus
 * moves here so that keyboard and screen-reader users meet it at once.
 */
export function NewTokenSecret({ created, onDone }: { created: CreatedToken; onDone: () => void }) {
  const headingRef = useRef<HTMLHeadingElement>(null);
  useEffect(() => headingRef.current?.focus(), [created.token]);
  return (
    <section aria-labelledby="new-token-heading" className="rounded-lg border-l-8 border-kelp-300 bg-ink-850 p-5 sm:p-6">
      <h2 id="new-token-heading" ref={headingRef} tabIndex={-1} className="text-xl font-bold text-foam-50">
        “{created.name}” is ready: its secret, once
      </h2>
      <p className="mt-2 flex items-start gap-2 font-bold text-lantern-300">
        <AlertIcon className="mt-1" />
        Tidefield keeps only a fingerprint of the secret, so this page is the one place it can be read. Store it where your scripts read it; if it is lost, revoke the token and make another.
      </p>
      <label htmlFor="new-token-secret" className="mt-4 block font-bold text-foam-50">
        Secret
      </label>
      <input
        id="new-token-secret"
        readOnly
        value={created.token}
        spellCheck={false}
        onFocus={(event) => event.currentTarget.select()}
        className="mt-1.5 min-h-11 w-full rounded-md border border-ink-500 bg-ink-900 px-3 py-2 font-mono text-base text-foam-50"
      />
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <CopyButton text={created.token} label="Copy the secret" variant="primary" size="md" />
      </div>
      <h3 className="mt-6 font-bold text-foam-50">A first call with it</h3>
      <CurlExample token={created.token} />
      <div className="mt-5">
        <Button variant="secondary" onClick={onDone}>
          Stored: hide the secret
        </Button>
      </div>
    </section>
  );
}
