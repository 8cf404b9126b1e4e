import { useEffect, useState } from "react";
import type { PadRunPreview } from "@shared/schemas/class-runs";

export type PadRunLookup =
  { status: "idle" } | { status: "pending" } | { status: "found"; run: PadRunPreview } | { status: "failed"; message: string };

/** The open run behind a join code, shown on the Roll pad before a group joins (no account needed). */
export async function getPadRun(code: string): Promise<PadRunPreview> {
  let response: Response;
  try {
    response = await fetch(`/api/pad/${encodeURIComponent(code)}`, { headers: { accept: "application/json" } });
  } catch {
    throw new Error("The class run could not be reached. Check the Wi-Fi and try again.");
  }
  const body = (await response.json().catch(() => null)) as
    (PadRunPreview & { error?: { message?: string; retryAfterMs?: number } }) | null;
  if (!response.ok || !body) throw new Error(body?.error?.message ?? "The class run could not be reached.");
  return body;
}

const lookups = new Map<string, Promise<PadRunPreview>>();

/** Starts (or joins) the lookup of a code; the pad's entry calls it before React renders, to save a round trip's wait. */
export function lookUpPadRun(code: string): Promise<PadRunPreview> {
  let lookup = lookups.get(code);
  if (!lookup) {
    lookup = getPadRun(code);
    lookups.set(code, lookup);
    // A failed lookup is tried afresh next time (the code may be typed again after the Wi-Fi comes back).
    lookup.catch(() => lookups.delete(code));
  }
  return lookup;
}

/**
 * The run behind a code, looked up once per code. The Roll pad talks to the server with a fetch and socket.io only, so
 * it carries no query cache (see DEVELOPERS.md).
 */
export function usePadRun(code: string | null): PadRunLookup {
  const [lookup, setLookup] = useState<PadRunLookup>({ status: code ? "pending" : "idle" });
  useEffect(() => {
    if (!code) {
      setLookup({ status: "idle" });
      return;
    }
    let current = true;
    setLookup({ status: "pending" });
    lookUpPadRun(code).then(
      (run) => current && setLookup({ status: "found", run }),
      (error: Error) => current && setLookup({ status: "failed", message: error.message }),
    );
    return () => {
      current = false;
    };
  }, [code]);
  return lookup;
}
