import { AnchorButton } from "@/components/ui/link-button";
import { exportLink } from "../api/export-links";

/** The run's three downloads; the toggle above them decides whether simulated rolls are in. */
export function ExportDownloads({ runId, includeSimulated }: { runId: string; includeSimulated: boolean }) {
  return (
    <div>
      <div className="flex flex-wrap gap-2">
        <AnchorButton href={exportLink(runId, "rolls.csv", includeSimulated)} download>
          ⤓ Rolls (CSV)
        </AnchorButton>
        <AnchorButton href={exportLink(runId, "summary.csv", includeSimulated)} download>
          ⤓ Summary (CSV)
        </AnchorButton>
        <AnchorButton href={exportLink(runId, "results.xlsx", includeSimulated)} download>
          ⤓ Rolls and summary (XLSX workbook)
        </AnchorButton>
      </div>
      <p className="mt-2 text-sm text-ink-soft">
        The rolls file has one row per roll: time, group nickname, matchup, dice per player, each face rolled, outcome and whether it was
        simulated. The summary has, per matchup and per group, the counts, the relative frequency, the exact probability and its Wilson 95%
        interval.
        {includeSimulated ? " Simulated rolls are included." : " Simulated rolls are left out."}
      </p>
    </div>
  );
}
