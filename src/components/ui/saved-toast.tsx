import { useEffect, useState } from "react";

/** How long a save confirmation stays on screen, in milliseconds. */
const SHOWN_MS = 5000;

/**
 * A save confirmation pinned to the bottom of the screen, so it is seen wherever the teacher pressed Save; it goes after a few
 * seconds. Give it a new `stamp` (e.g. the save's time) for each save. Pair it with a status line in the page for screen readers.
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
    // Seen, not announced: the editor's own status line says the same to screen readers.
    <div className="pointer-events-none fixed inset-x-0 bottom-4 z-40 flex justify-center px-4" aria-hidden="true">
      {visible && message !== null && (
        <p
          data-testid="saved-toast"
          className="pointer-events-auto rounded-xl border-2 border-tide bg-tide-light px-5 py-3 text-lg font-bold text-ink shadow-lg"
        >
          ✓ {message}
        </p>
      )}
    </div>
  );
}
