import type { SetFinderJob, SetFinderRequest } from "@shared/schemas/set-finder";
import { HttpError, notFound } from "../http-error";
import type { TeacherContext } from "../middleware/require-teacher";
import { cancelSearchJob, findSearchJob, SearchLimitError, startSearchJob } from "../set-finder/search-jobs";

/** Starts a Set finder search for the teacher; the search runs in a worker thread. */
export function startSearch(teacher: TeacherContext, request: SetFinderRequest): { id: string } {
  try {
    return { id: startSearchJob(teacher.user.id, request) };
  } catch (error) {
    if (error instanceof SearchLimitError) throw new HttpError(429, "too_many_searches", error.message);
    throw error;
  }
}

/** The teacher's search with its progress and verified results so far. */
export function getSearch(teacher: TeacherContext, id: string): SetFinderJob {
  const job = findSearchJob(teacher.user.id, id);
  if (!job) throw notFound("That search");
  return job;
}

/** Cancels the teacher's running search. */
export async function cancelSearch(teacher: TeacherContext, id: string): Promise<SetFinderJob> {
  const job = await cancelSearchJob(teacher.user.id, id);
  if (!job) throw notFound("That search");
  return job;
}
