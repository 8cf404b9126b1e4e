import { useEffect, useState } from "react";

/** How long a save confirmation stays on screen, in milliseconds. */
const SHOWN_MS = 5000;

/**
 * A save confirmation pinned to the bottom of the screen, so it is seen wherever the teacher pressed Save; it fades after a few
 * seconds. Give it a new `stamp` (e.g. the save's time) for each save.
 */
export function SavedToast({ message, stamp }: { message: string | null; stamp: number }) {
  const [visible, setVisible] = useState(false);
  useEffect(() => {
    if (message === null) return;
    setVisible(true);
    const timer = window.setTimeout(() => setVisible(false), SHOWN_MS);
    return () => window.clearTimeout(timer);
  }, [message, stamp]);
  return (
    <div className="pointer-events-none fixed inset-x-0 bottom-4 z-40 flex justify-center px-4" aria-live="polite">
      {visible && message !== null && (
        <p role="status" data-testid="saved-toast" className="pointer-events-auto rounded-xl border-2 border-tide bg-tide-light px-5 py-3 text-lg font-bold text-ink shadow-lg">
          ✓ {message}
        </p>
      )}
    </div>
  );
}
