import { useEffect, useRef } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { useNavigate, useSearchParams } from "react-router-dom";
import type { SetFinderJob } from "@shared/schemas/set-finder";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { ProgressBar } from "@/components/ui/progress-bar";
import { useCancelSearch } from "../api/cancel-search";
import { searchIsActive, useSearch } from "../api/get-search";
import { recentSearchesQueryOptions } from "../api/list-searches";
import { useStartSearch } from "../api/start-search";
import { draftFromFoundSet, FoundSetCard } from "./found-set-card";
import { RecentSearches } from "./recent-searches";
import { SetFinderForm } from "./set-finder-form";

/** Time left in words: "about 40 s left", "about 3 min left". */
export function timeLeftText(seconds: number | null): string {
  if (seconds === null) return "estimating time left…";
  if (seconds < 1) return "almost done";
  if (seconds < 90) return `about ${Math.ceil(seconds)} s left`;
  return `about ${Math.round(seconds / 60)} min left`;
}

const statusWords: Record<SetFinderJob["status"], string> = {
  queued: "Waiting for a free search slot",
  running: "Searching",
  finished: "Finished",
  cancelled: "Cancelled",
  failed: "Stopped by a problem",
};

/** How much of the search space has been looked at, in words; never "0 of 0" before the first count arrives. */
export function examinedText(job: Pick<SetFinderJob, "status" | "progress">): string {
  const { examined, total } = job.progress;
  if (job.status === "queued") return "Waiting for a free search slot; it starts on its own.";
  if (total === 0) return job.status === "running" ? "Counting the candidate sets…" : "No candidate set was examined.";
  const counted = `${examined.toLocaleString()} of ${total.toLocaleString()} candidate sets examined`;
  return job.status === "cancelled" ? `Cancelled: ${counted} (${Math.round(job.progress.fraction * 100)}%)` : counted;
}

/** The Set finder: state what the set must do, watch the search, and open any result in the Dice bench. */
export function SetFinderScreen() {
  const navigate = useNavigate();
  const [params, setParams] = useSearchParams();
  const searchId = params.get("search");
  const start = useStartSearch();
  const cancel = useCancelSearch();
  const search = useSearch(searchId);
  const job = search.data;
  const running = job?.status === "running";
  // Waiting or running: the Cancel button stays until the search has ended.
  const active = job !== undefined && searchIsActive(job);
  const queryClient = useQueryClient();
  const ended = job !== undefined && !active;
  // When the search on screen ends, the recent list shows its outcome.
  useEffect(() => {
    if (ended) void queryClient.invalidateQueries({ queryKey: recentSearchesQueryOptions().queryKey });
  }, [ended, queryClient]);
  const resultsHeading = useRef<HTMLHeadingElement>(null);

  return (
    <>
      <PageHeader
        title="Set finder"
        lead="Describe the dice set you need; Outroll searches for sets that do it, checks each one exactly and ranks them."
      />
      <div className="grid min-w-0 gap-6 lg:grid-cols-[minmax(0,28rem)_minmax(0,1fr)]">
        <section aria-labelledby="finder-request-heading" className="min-w-0">
          <h2 id="finder-request-heading" className="mb-3 text-2xl">
            What you want
          </h2>
          <SetFinderForm
            busy={start.isPending}
            disabled={active}
            onSearch={(request) =>
              start.mutate(request, {
                onSuccess: ({ id }) => {
                  setParams({ search: id }, { replace: false });
                  // On a phone the results sit below the form: bring them into view.
                  resultsHeading.current?.scrollIntoView({ block: "start" });
                },
              })
            }
          />
          {start.error && (
            <div className="mt-3">
              <Alert tone="error" title="The search did not start">
                {start.error.message}
              </Alert>
            </div>
          )}
        </section>
        <section aria-labelledby="finder-results-heading" className="flex min-w-0 flex-col gap-4">
          <h2 id="finder-results-heading" ref={resultsHeading} className="scroll-mt-4 text-2xl">
            Search and results
          </h2>
          {!searchId && <p className="text-ink-soft">Results appear here, best first, as soon as you start a search.</p>}
          {searchId && search.isPending && <p role="status">Starting the search…</p>}
          {search.isError && (
            <Alert tone="error" title="The search could not be read">
              {search.error.message}
            </Alert>
          )}
          {job && (
            <div className="flex flex-col gap-3 rounded-xl border-2 border-line bg-shell p-4" aria-live="polite">
              <ProgressBar
                label={`${statusWords[job.status]}${job.mode ? ` (${job.mode === "exhaustive" ? "every candidate" : "randomised search"})` : ""}`}
                fraction={job.status === "finished" ? 1 : job.progress.fraction}
                detail={running && job.progress.total > 0 ? timeLeftText(job.progress.etaSeconds) : undefined}
              />
              <p className="text-sm text-ink-soft">
                {examinedText(job)}
                {job.results.length > 0
                  ? ` · ${job.results.length} ${job.results.length === 1 ? "set" : "sets"} found${running ? " so far" : ""}`
                  : ""}
              </p>
              {active && (
                <Button variant="danger" className="w-fit" busy={cancel.isPending} onClick={() => cancel.mutate(job.id)}>
                  Cancel the search
                </Button>
              )}
              {job.status === "finished" && (
                <p role="status" className="font-bold">
                  ✓ Finished: {job.results.length} {job.results.length === 1 ? "set" : "sets"} found.{" "}
                  {job.complete
                    ? "Every candidate was checked, so these are the best sets there are."
                    : "The search stopped at its time limit; these are the best it found."}
                </p>
              )}
              {job.status === "cancelled" && (
                <p role="status" className="font-bold">
                  Search cancelled after examining {Math.round(job.progress.fraction * 100)}% of the candidates.{" "}
                  {job.results.length > 0 ? "The sets found before it stopped are listed below." : "No set had been found yet."}
                </p>
              )}
              {job.status === "failed" && (
                <Alert tone="error" title="The search stopped">
                  {job.message ?? "Something went wrong on the server."}
                </Alert>
              )}
              {job.message && (job.status === "running" || job.status === "finished") && <p className="text-sm">{job.message}</p>}
              {cancel.error && (
                <Alert tone="error" title="Not cancelled">
                  {cancel.error.message}
                </Alert>
              )}
            </div>
          )}
          {job && job.results.length > 0 && (
            <ol className="flex flex-col gap-3" aria-label="Found sets, best first">
              {job.results.map((found, index) => (
                <FoundSetCard
                  key={found.dice.map((die) => die.faces.join(".")).join("|")}
                  found={found}
                  rank={index + 1}
                  onOpen={() => navigate("/app/bench/new", { state: { draft: draftFromFoundSet(found, index + 1, job.request) } })}
                />
              ))}
            </ol>
          )}
          {job && job.status === "finished" && job.results.length === 0 && (
            <Alert tone="info" title="No set does all of that">
              Try more faces, a wider range of face values, allowing ties, or a simpler property.
            </Alert>
          )}
        </section>
      </div>
      <div className="mt-8">
        <RecentSearches currentId={searchId} />
      </div>
    </>
  );
}
