import { useEffect, useRef, useState } from "react";
import type { GroupedTree } from "@shared/probability/index";
import type { GroupedTreeRequest } from "./matchup-figures-worker";

type Answer = { id: number; tree?: GroupedTree; error?: string };

let worker: Worker | null = null;
let nextId = 1;
const waiting = new Map<number, (answer: Answer) => void>();

/** One worker for the page, started on first use; answers are matched to requests by id. */
function figuresWorker(): Worker {
  if (worker === null) {
    worker = new Worker(new URL("./matchup-figures-worker.ts", import.meta.url), { type: "module" });
    worker.addEventListener("message", (event: MessageEvent<Answer>) => {
      waiting.get(event.data.id)?.(event.data);
      waiting.delete(event.data.id);
    });
  }
  return worker;
}

/**
 * The grouped tree diagram of a matchup, worked out in a Web Worker so a large one (millions of paths) never holds up the page;
 * null while it is being worked out. Pass null to ask for nothing.
 */
export function useGroupedTree(matchup: { first: number[]; second: number[]; dicePerPlayer: number } | null): {
  tree: GroupedTree | null;
  error: string | null;
} {
  const [answer, setAnswer] = useState<{ key: string; tree: GroupedTree | null; error: string | null } | null>(null);
  const key = matchup === null ? "" : `${matchup.dicePerPlayer}|${matchup.first.join(",")}|${matchup.second.join(",")}`;
  // The key holds everything the request depends on; the matchup itself is read through a ref, the latest one.
  const latestMatchup = useRef(matchup);
  useEffect(() => {
    latestMatchup.current = matchup;
  });
  useEffect(() => {
    const matchup = latestMatchup.current;
    if (matchup === null) return;
    const id = nextId++;
    let current = true;
    waiting.set(id, (reply) => {
      if (current) setAnswer({ key, tree: reply.tree ?? null, error: reply.error ?? null });
    });
    const request: GroupedTreeRequest = { id, first: matchup.first, second: matchup.second, dicePerPlayer: matchup.dicePerPlayer };
    figuresWorker().postMessage(request);
    return () => {
      current = false;
      waiting.delete(id);
    };
  }, [key]);
  if (answer === null || answer.key !== key) return { tree: null, error: null };
  return { tree: answer.tree, error: answer.error };
}
