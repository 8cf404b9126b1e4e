import { and, desc, eq, inArray, notInArray, sql } from "drizzle-orm";
import type { FoundSet, SetFinderMode, SetFinderProgress, SetFinderRequest, SetFinderStatus } from "@shared/schemas/set-finder";
import type { Executor } from "../client";
import { setFinderSearch } from "../schema/index";

export type SetFinderSearchRow = typeof setFinderSearch.$inferSelect;

/** Takes a transaction-long lock on one teacher's searches, so two starts at once count each other. */
export async function lockTeacherSearches(tx: Executor, ownerId: string) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`set-finder:${ownerId}`}))`);
}

/** How many of the teacher's searches are waiting or running. */
export async function countActiveSearches(tx: Executor, ownerId: string): Promise<number> {
  const [row] = await tx
    .select({ count: sql<number>`count(*)::int` })
    .from(setFinderSearch)
    .where(and(eq(setFinderSearch.ownerId, ownerId), inArray(setFinderSearch.status, ["queued", "running"])));
  return row.count;
}

export async function insertSearch(
  tx: Executor,
  values: { id: string; ownerId: string; request: SetFinderRequest; progress: SetFinderProgress; message: string },
) {
  await tx.insert(setFinderSearch).values({ ...values, status: "queued", results: [] });
}

/** Deletes the teacher's ended searches beyond the newest `keep`. */
export async function forgetOldSearches(tx: Executor, ownerId: string, keep: number) {
  const kept = tx
    .select({ id: setFinderSearch.id })
    .from(setFinderSearch)
    .where(eq(setFinderSearch.ownerId, ownerId))
    .orderBy(desc(setFinderSearch.startedAt))
    .limit(keep);
  await tx
    .delete(setFinderSearch)
    .where(
      and(
        eq(setFinderSearch.ownerId, ownerId),
        notInArray(setFinderSearch.status, ["queued", "running"]),
        notInArray(setFinderSearch.id, kept),
      ),
    );
}

export async function findSearch(tx: Executor, id: string): Promise<SetFinderSearchRow | null> {
  const [row] = await tx.select().from(setFinderSearch).where(eq(setFinderSearch.id, id));
  return row ?? null;
}

/** The teacher's searches, newest first. */
export async function listSearches(tx: Executor, ownerId: string, limit: number): Promise<SetFinderSearchRow[]> {
  return tx
    .select()
    .from(setFinderSearch)
    .where(eq(setFinderSearch.ownerId, ownerId))
    .orderBy(desc(setFinderSearch.startedAt))
    .limit(limit);
}

/** Asks for a search to stop; a search still waiting for a slot ends at once. Answers the row, or null when not the owner's. */
export async function requestCancel(tx: Executor, ownerId: string, id: string): Promise<SetFinderSearchRow | null> {
  const [row] = await tx
    .update(setFinderSearch)
    .set({
      cancelRequested: true,
      status: sql`case when ${setFinderSearch.status} = 'queued' then 'cancelled' else ${setFinderSearch.status} end`,
      message: sql`case when ${setFinderSearch.status} = 'queued' then 'Cancelled before it started.' else ${setFinderSearch.message} end`,
      finishedAt: sql`case when ${setFinderSearch.status} = 'queued' then now() else ${setFinderSearch.finishedAt} end`,
    })
    .where(and(eq(setFinderSearch.id, id), eq(setFinderSearch.ownerId, ownerId)))
    .returning();
  return row ?? null;
}

export type SearchProgressUpdate = {
  mode: SetFinderMode | null;
  progress: SetFinderProgress;
  results: FoundSet[];
  complete: boolean;
  message?: string;
};

/** Writes a running search's progress; answers whether its owner has asked it to stop (null when the row is gone). */
export async function writeSearchProgress(tx: Executor, id: string, update: SearchProgressUpdate): Promise<boolean | null> {
  const [row] = await tx
    .update(setFinderSearch)
    .set({
      mode: update.mode,
      progress: update.progress,
      results: update.results,
      complete: update.complete,
      message: update.message ?? null,
    })
    .where(and(eq(setFinderSearch.id, id), eq(setFinderSearch.status, "running")))
    .returning({ cancelRequested: setFinderSearch.cancelRequested });
  return row ? row.cancelRequested : null;
}

/** Marks a search as taken up by a process (again, after a retry): its progress starts afresh. Null when it was cancelled meanwhile. */
export async function markSearchRunning(
  tx: Executor,
  id: string,
  progress: SetFinderProgress,
  message: string,
): Promise<SetFinderSearchRow | null> {
  const [row] = await tx
    .update(setFinderSearch)
    .set({ status: "running", progress, results: [], mode: null, complete: false, message })
    .where(
      and(eq(setFinderSearch.id, id), inArray(setFinderSearch.status, ["queued", "running"]), eq(setFinderSearch.cancelRequested, false)),
    )
    .returning();
  return row ?? null;
}

/** Ends a search with its final status. */
export async function endSearch(
  tx: Executor,
  id: string,
  status: Exclude<SetFinderStatus, "queued" | "running">,
  update: Partial<SearchProgressUpdate>,
) {
  await tx
    .update(setFinderSearch)
    .set({ ...update, message: update.message ?? null, status, finishedAt: sql`now()` })
    .where(and(eq(setFinderSearch.id, id), inArray(setFinderSearch.status, ["queued", "running"])));
}

/** Puts a search back in the queue (its process is stopping; another picks it up). */
export async function requeueSearch(tx: Executor, id: string, message: string) {
  await tx
    .update(setFinderSearch)
    .set({ status: "queued", message })
    .where(and(eq(setFinderSearch.id, id), eq(setFinderSearch.status, "running")));
}
