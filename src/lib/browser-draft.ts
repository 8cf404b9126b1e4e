import { useCallback, useEffect, useState } from "react";

/** Every draft key starts with this, so signing out can clear them all. */
const DRAFT_PREFIX = "outroll:draft:";
/** How long after the last change a draft is written, in milliseconds. */
const DRAFT_WRITE_DELAY_MS = 400;

/** An editor's unsaved values kept in this browser, with when they were kept and the saved version they started from. */
export interface BrowserDraft<T> {
  values: T;
  keptAt: string;
  baseVersion: number | null;
}

/** The storage key of an editor's draft: `kind` names the editor, `id` the record (or "new"). */
export function draftKey(kind: "dice-set" | "lesson", id: string | null): string {
  return `${DRAFT_PREFIX}${kind}:${id ?? "new"}`;
}

function storage(): Storage | null {
  try {
    return typeof window === "undefined" ? null : window.localStorage;
  } catch {
    return null;
  }
}

/** The draft under `key`, or null when there is none or it no longer parses. */
export function readDraft<T>(key: string, parse: (values: unknown) => T | null): BrowserDraft<T> | null {
  const raw = storage()?.getItem(key);
  if (!raw) return null;
  try {
    const stored = JSON.parse(raw) as { values?: unknown; keptAt?: unknown; baseVersion?: unknown };
    const values = parse(stored.values);
    if (values === null || typeof stored.keptAt !== "string") return null;
    return { values, keptAt: stored.keptAt, baseVersion: typeof stored.baseVersion === "number" ? stored.baseVersion : null };
  } catch {
    return null;
  }
}

/** Keeps a draft; a full or refused storage only loses the draft, never the edits on screen. */
export function writeDraft<T>(key: string, values: T, baseVersion: number | null): void {
  try {
    storage()?.setItem(key, JSON.stringify({ values, keptAt: new Date().toISOString(), baseVersion }));
  } catch {
    // Storage full or blocked: the page still warns before leaving.
  }
}

export function clearDraft(key: string): void {
  storage()?.removeItem(key);
}

/** Removes every editor draft in this browser (on signing out, so the next person at a shared computer sees none). */
export function clearAllDrafts(): void {
  const store = storage();
  if (!store) return;
  const keys: string[] = [];
  for (let index = 0; index < store.length; index += 1) {
    const key = store.key(index);
    if (key?.startsWith(DRAFT_PREFIX)) keys.push(key);
  }
  for (const key of keys) store.removeItem(key);
}

/**
 * The draft an editor found in this browser when it opened, offered for restoring until the teacher restores (`dismiss`) or
 * discards it. Call `saved()` after a successful save. Writing drafts is `useDraftWriter`'s job, kept apart so that only the
 * component that watches every keystroke re-renders on one.
 */
export function useBrowserDraft<T>({ key, parse }: { key: string; parse: (values: unknown) => T | null }) {
  const [found, setFound] = useState(() => readDraft(key, parse));
  const dismiss = useCallback(() => setFound(null), []);
  const discard = useCallback(() => {
    clearDraft(key);
    setFound(null);
  }, [key]);
  const saved = useCallback(() => {
    clearDraft(key);
    setFound(null);
  }, [key]);
  return { found, dismiss, discard, saved };
}

/**
 * Keeps an editor's values as its browser draft: written shortly after each change while `dirty`, removed when the form is back
 * to its saved values. While `paused` (a kept draft is being offered) nothing is written, so editing cannot overwrite it unseen.
 */
export function useDraftWriter<T>({
  key,
  values,
  dirty,
  baseVersion,
  paused,
}: {
  key: string;
  values: T;
  dirty: boolean;
  baseVersion: number | null;
  paused: boolean;
}) {
  useEffect(() => {
    if (paused) return;
    // Back to the saved values: nothing is left to recover.
    if (!dirty) return clearDraft(key);
    const timer = window.setTimeout(() => writeDraft(key, values, baseVersion), DRAFT_WRITE_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [key, values, dirty, baseVersion, paused]);
}
