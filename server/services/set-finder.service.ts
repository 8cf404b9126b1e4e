import type { SetFinderJob, SetFinderRequest, SetFinderSearchSummary } from "@shared/schemas/set-finder";
import { db } from "../db/client";
import {
  countActiveSearches,
  findSearch,
  forgetOldSearches,
  insertSearch,
  listSearches,
  lockTeacherSearches,
  requestCancel,
  type SetFinderSearchRow,
} from "../db/queries/set-finder-searches";
import { HttpError, notFound } from "../http-error";
import { isLimitRefusal, sharedLimiter } from "../limits/shared-limiter";
import { logger } from "../logger";
import type { TeacherContext } from "../middleware/require-teacher";
import { emptyProgress, enqueueSearch, STOP_GRACE_MS } from "../set-finder/search-queue";

/** Searches one teacher may have waiting or running at once. */
export const ACTIVE_PER_TEACHER = 2;
/** Searches kept per teacher (the page lists them); the oldest ended one goes first. */
export const KEPT_PER_TEACHER = 10;
/** Searches one teacher may start per hour, counted across every process, so a few accounts cannot keep the queue full. */
export const STARTS_PER_HOUR = 30;

const startsPerHour = sharedLimiter({ keyPrefix: "set-finder-starts", points: STARTS_PER_HOUR, duration: 3600 });

function jobFromRow(row: SetFinderSearchRow): SetFinderJob {
  return {
    id: row.id,
    status: row.status,
    request: row.request,
    mode: row.mode,
    progress: row.progress,
    results: row.results,
    complete: row.complete,
    message: row.message ?? undefined,
    startedAt: row.startedAt.toISOString(),
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}

/** Queues a Set finder search for the teacher; any app process's search slot takes it up. */
export async function startSearch(teacher: TeacherContext, request: SetFinderRequest): Promise<{ id: string }> {
  const id = crypto.randomUUID();
  try {
    await startsPerHour.consume(teacher.user.id);
  } catch (error) {
    if (isLimitRefusal(error))
      throw new HttpError(
        429,
        "too_many_searches",
        `You have started ${STARTS_PER_HOUR} searches this hour; wait a while before starting another.`,
      );
    throw error;
  }
  await db.transaction(async (tx) => {
    await lockTeacherSearches(tx, teacher.user.id);
    if ((await countActiveSearches(tx, teacher.user.id)) >= ACTIVE_PER_TEACHER) {
      throw new HttpError(
        429,
        "too_many_searches",
        `You already have ${ACTIVE_PER_TEACHER} searches running; wait for one to finish or cancel it.`,
      );
    }
    await insertSearch(tx, { id, ownerId: teacher.user.id, request, progress: emptyProgress, message: "Waiting for a free search slot…" });
    await forgetOldSearches(tx, teacher.user.id, KEPT_PER_TEACHER);
  });
  try {
    await enqueueSearch(id, request);
  } catch (error) {
    logger.error({ err: error, searchId: id }, "could not queue a Set finder search");
    await requestCancel(db, teacher.user.id, id);
    throw new HttpError(503, "search_not_queued", "The search could not be queued just now; try again in a moment.");
  }
  return { id };
}

/** The teacher's search with its progress and verified results so far. */
export async function getSearch(teacher: TeacherContext, id: string): Promise<SetFinderJob> {
  const row = await findSearch(db, id);
  if (!row || row.ownerId !== teacher.user.id) throw notFound("That search");
  return jobFromRow(row);
}

/** The teacher's recent searches, newest first, without their result sets. */
export async function listRecentSearches(teacher: TeacherContext): Promise<SetFinderSearchSummary[]> {
  const rows = await listSearches(db, teacher.user.id, KEPT_PER_TEACHER);
  return rows.map((row) => {
    const { results, ...job } = jobFromRow(row);
    return { ...job, resultCount: results.length, bestWeakestCycleWin: results[0]?.figures.weakestCycleWin ?? null };
  });
}

/**
 * Cancels the teacher's search from whichever process gets the request: the row is marked, the process running the
 * search sees the mark within a fraction of a second and hands back its best verified sets. Waits for that, briefly.
 */
export async function cancelSearch(teacher: TeacherContext, id: string): Promise<SetFinderJob> {
  let row = await requestCancel(db, teacher.user.id, id);
  if (!row) throw notFound("That search");
  const until = Date.now() + STOP_GRACE_MS + 3_000;
  while (row.status === "running" && Date.now() < until) {
    await new Promise((resolve) => setTimeout(resolve, 150));
    row = (await findSearch(db, id)) ?? row;
  }
  return jobFromRow(row);
}
