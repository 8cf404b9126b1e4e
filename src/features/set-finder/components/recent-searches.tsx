import { Link } from "react-router-dom";
import type { SetFinderSearchSummary } from "@shared/schemas/set-finder";
import { useRecentSearches } from "../api/list-searches";

const startedAt = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" });

const shortProperty: Record<SetFinderSearchSummary["request"]["property"], string> = {
  "one-cycle": "one cycle",
  "reversing-cycle": "a cycle that reverses",
  "two-cycles": "two cycles",
};

/** What became of a search, in a few words: its status with the share examined or the sets found. */
export function searchOutcomeText(search: SetFinderSearchSummary): string {
  const found = `${search.resultCount} ${search.resultCount === 1 ? "set" : "sets"} found`;
  switch (search.status) {
    case "queued":
      return "Waiting for a free search slot";
    case "running":
      return `Searching · ${Math.round(search.progress.fraction * 100)}%`;
    case "finished":
      return `Finished · ${found}`;
    case "cancelled":
      return `Cancelled at ${Math.round(search.progress.fraction * 100)}% examined · ${found}`;
    case "failed":
      return "Stopped by a problem";
  }
}

/** The teacher's recent searches, kept on the server: open one to see its results again. */
export function RecentSearches({ currentId }: { currentId: string | null }) {
  const recent = useRecentSearches();
  if (!recent.data || recent.data.length === 0) return null;
  return (
    <section aria-labelledby="recent-searches-heading" className="flex flex-col gap-2">
      <h2 id="recent-searches-heading" className="text-2xl">
        Your recent searches
      </h2>
      <ul className="flex flex-col gap-2">
        {recent.data.map((search) => {
          const { request } = search;
          const current = search.id === currentId;
          return (
            <li key={search.id}>
              <Link
                to={`?search=${search.id}`}
                aria-current={current ? "true" : undefined}
                className={`flex min-h-11 flex-col gap-0.5 rounded-lg border-2 px-3 py-2 hover:border-tide ${current ? "border-tide bg-white" : "border-line bg-shell"}`}
              >
                <span className="font-bold">
                  {request.diceCount} dice × {request.facesPerDie} faces, {shortProperty[request.property]}
                  {search.bestWeakestCycleWin ? ` · best weakest win ${search.bestWeakestCycleWin}` : ""}
                </span>
                <span className="text-sm text-ink-soft">
                  {startedAt.format(new Date(search.startedAt))} · {searchOutcomeText(search)}
                </span>
              </Link>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
