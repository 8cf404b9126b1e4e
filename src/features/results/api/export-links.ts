/** Addresses of a run's downloads; the browser fetches them itself, so each is a plain link. */
export function exportLink(runId: string, file: "rolls.csv" | "summary.csv" | "results.xlsx", includeSimulated: boolean): string {
  return `/api/results/runs/${encodeURIComponent(runId)}/${file}?includeSimulated=${includeSimulated}`;
}
