/**
 * Unsaved changes are not lost by accident: closing or reloading the tab asks the browser's own
 * question, and leaving by a link inside the app is held until the person confirms. The address
 * change that follows a save (to ?from=<new version>) is let through.
 */
import { useEffect, useRef } from 'react';
import { useBlocker } from 'react-router';

/** `searchIsView`: the page keeps only view choices in its query string (e.g. which record), so changing it is not leaving. */
export function useLeaveGuard(dirty: boolean, { searchIsView = false }: { searchIsView?: boolean } = {}) {
  const dirtyRef = useRef(dirty);
  dirtyRef.current = dirty;
  /** The id of the version this editor just saved; moving to it is not leaving. */
  const justSaved = useRef<string | null>(null);

  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  const blocker = useBlocker(({ currentLocation, nextLocation }) => {
    if (!dirtyRef.current) return false;
    const samePage = currentLocation.pathname === nextLocation.pathname;
    if (samePage && new URLSearchParams(nextLocation.search).get('from') === justSaved.current && justSaved.current) return false;
    return !samePage || (!searchIsView && currentLocation.search !== nextLocation.search);
  });
  return { blocker, justSaved };
}
