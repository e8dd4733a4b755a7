import { useEffect, useRef, type ReactNode } from 'react';
import { useBlocker } from 'react-router-dom';
import { ConfirmDialog } from '../components/ui/confirm-dialog.tsx';

export interface UnsavedChangesGuard {
  /** Lets the next navigation through (call it just before navigating away after a save). */
  release: () => void;
  /** The "Leave without saving?" dialog; render it once in the page. */
  dialog: ReactNode;
}

/**
 * While `dirty`, asks before the user leaves the page inside the app (to another path) and
 * lets the browser ask before the tab is closed or reloaded. With `search`, a new query on the
 * same path asks too: for a page whose query chooses what is being edited (the new-scenario
 * page keeps the example it started from in `?preset=`, and another example replaces the builder).
 */
export function useUnsavedChanges(dirty: boolean, what: string, options: { search?: boolean } = {}): UnsavedChangesGuard {
  const released = useRef(false);
  const dirtyRef = useRef(dirty);
  dirtyRef.current = dirty;
  if (!dirty) released.current = false;

  const watchSearch = options.search ?? false;
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) =>
      dirtyRef.current && !released.current && (currentLocation.pathname !== nextLocation.pathname || (watchSearch && currentLocation.search !== nextLocation.search)),
  );

  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  return {
    release: () => {
      released.current = true;
    },
    dialog: (
      <ConfirmDialog
        open={blocker.state === 'blocked'}
        title="Leave without saving?"
        confirmLabel="Leave and lose the changes"
        cancelLabel="Stay on the page"
        tone="danger"
        onConfirm={() => blocker.proceed?.()}
        onCancel={() => blocker.reset?.()}
      >
        {what} has changes that are not saved. They are lost if you leave now.
      </ConfirmDialog>
    ),
  };
}
