import { type RefObject, useEffect } from "react";
import { useBlocker } from "react-router-dom";

/**
 * Guards an editor with unsaved changes: the browser asks before closing or reloading the tab (`beforeunload`), and
 * navigation inside the app is held by React Router's blocker until the teacher stays or leaves (render `LeavePageDialog`).
 * While `letThrough.current` is true (set just before moving on after a save) navigation is not held.
 */
export function useUnsavedChangesGuard(dirty: boolean, letThrough?: RefObject<boolean>) {
  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [dirty]);
  return useBlocker(
    ({ currentLocation, nextLocation }) => dirty && !letThrough?.current && currentLocation.pathname !== nextLocation.pathname,
  );
}
