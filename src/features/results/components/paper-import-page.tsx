import { useEffect, useMemo, useState, type FormEvent } from "react";
import { Link } from "react-router-dom";
import { csvLines } from "@shared/results/csv-text";
import { paperImportColumnHelp, paperImportColumns } from "@shared/schemas/paper-import";
import { PAPER_IMPORT_MAX_BYTES, type PaperImportResult, type ResultsDie } from "@shared/schemas/results";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { PageHeader } from "@/components/ui/page-header";
import { modeLabel } from "@/lib/probability-text";
import { useCommitPaperImport } from "../api/commit-paper-import";
import { useRunResults } from "../api/get-run-results";
import { usePreviewPaperImport } from "../api/preview-paper-import";
import { dayText, playersText, plural } from "./figures";
import { PupilDataNote } from "./pupil-data-note";

/** Example rows in the Paper import format, made from the run's own dice and mode. */
function exampleCsv(dice: ResultsDie[], dicePerPlayer: number, players: number, nickname: string): string {
  const faces = (die: ResultsDie, shift: number) =>
    Array.from({ length: dicePerPlayer }, (_, index) => die.faces[(shift + index * 2) % die.faces.length]).join("+");
  const row = (roll: number, first: number, second: number, third: number) => ({
    group: nickname,
    roll,
    die_1: dice[first].name,
    faces_1: faces(dice[first], roll),
    die_2: dice[second].name,
    faces_2: faces(dice[second], roll + 3),
    die_3: players === 3 ? dice[third].name : "",
    faces_3: players === 3 ? faces(dice[third], roll + 1) : "",
  });
  const third = dice.length > 2 ? 2 : 0;
  // The same formula escaping as every download (a die named "=…" must not become a formula); Paper import undoes it.
  return csvLines(paperImportColumns, [row(1, 0, 1, third), row(2, 0, 1, third), row(3, 0, 1, third)], { header: true }).trimEnd();
}

const statusWords: Record<PaperImportResult["rows"][number]["status"], string> = {
  new: "New",
  present: "Already stored",
  "present-but-different": "Already stored (kept as stored)",
};

/** Paper import: upload the CSV typed up from the recording sheets, check it, see each bad row by number, then import. */
export function PaperImportPage({ runId }: { runId: string }) {
  const results = useRunResults(runId, true);
  const preview = usePreviewPaperImport();
  const commit = useCommitPaperImport();
  const [file, setFile] = useState<File | null>(null);
  const [createGroups, setCreateGroups] = useState(false);
  const [tally, setTally] = useState(1);
  const [fileKey, setFileKey] = useState(0);
  const run = results.data?.run;
  const mode = run?.tallies.find((entry) => entry.tally === tally) ?? run?.tallies[0];
  const example = useMemo(
    () => (run && mode ? exampleCsv(run.dice, mode.dicePerPlayer, mode.players, results.data?.groups[0]?.nickname ?? "Puffins") : ""),
    [run, mode, results.data],
  );
  const templateUrl = useMemo(() => (example ? URL.createObjectURL(new Blob([`${example}\r\n`], { type: "text/csv" })) : null), [example]);
  useEffect(() => () => void (templateUrl && URL.revokeObjectURL(templateUrl)), [templateUrl]);

  if (results.isPending) return <p role="status">Loading the run…</p>;
  if (results.isError || !run || !mode) {
    return (
      <Alert tone="error" title="This run could not be loaded">
        {results.error?.message}{" "}
        <Link to="/app/results" className="font-bold underline">
          Back to Results
        </Link>
      </Alert>
    );
  }

  const checked = preview.data;
  const imported = commit.data;
  const request = file ? { runId, file, createGroups, tally: mode.tally } : null;
  const reset = () => {
    preview.reset();
    commit.reset();
  };
  const check = (event: FormEvent) => {
    event.preventDefault();
    if (!request) return;
    commit.reset();
    preview.mutate(request);
  };
  const importRows = () => {
    if (request) commit.mutate(request, { onSuccess: () => preview.reset() });
  };
  const tooLarge = file !== null && file.size > PAPER_IMPORT_MAX_BYTES;

  return (
    <>
      <p className="mb-2">
        <Link to={`/app/results/${run.id}`} className="font-bold text-tide-dark underline underline-offset-2">
          ← {run.title}
        </Link>
      </p>
      <PageHeader
        title="Paper import"
        lead={`Rolls recorded on the printed sheets, typed up into a CSV file, for “${run.title}” (${run.classGroup || "no class"}, ${dayText(run.taughtAt)}): ${modeLabel(mode.dicePerPlayer)}, ${playersText(mode.players)}.`}
      />

      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="min-w-0">
          <form
            onSubmit={check}
            className="mb-6 flex flex-col gap-4 rounded-2xl border-2 border-line bg-shell p-4"
            aria-label="Paper import file"
          >
            <div className="flex flex-col gap-1">
              <label htmlFor="paper-import-file" className="font-bold">
                CSV file typed up from the recording sheets
              </label>
              <p id="paper-import-file-hint" className="text-sm text-ink-soft">
                One row per roll, with a header row naming the columns. Up to {PAPER_IMPORT_MAX_BYTES / 1024} KB. In a spreadsheet, choose
                “Save as” → “CSV UTF-8”.
              </p>
              <input
                key={fileKey}
                id="paper-import-file"
                type="file"
                accept=".csv,text/csv"
                aria-describedby="paper-import-file-hint"
                className="min-h-11 rounded-lg border-2 border-line bg-white p-2 file:mr-3 file:rounded-lg file:border-0 file:bg-tide file:px-3 file:py-2 file:font-bold file:text-white"
                onChange={(event) => {
                  setFile(event.target.files?.[0] ?? null);
                  reset();
                }}
              />
              {tooLarge && (
                <p className="text-sm font-bold text-alarm">
                  This file is larger than {PAPER_IMPORT_MAX_BYTES / 1024} KB; split the rolls into several files.
                </p>
              )}
            </div>
            {run.tallies.length > 1 && (
              <ChoiceGroup<string>
                legend="Which part of the lesson the sheets recorded"
                value={String(mode.tally)}
                onChange={(value) => {
                  setTally(Number(value));
                  reset();
                }}
                options={run.tallies.map((entry) => ({
                  value: String(entry.tally),
                  label: `${entry.tally === 1 ? "Roll" : `Twist (tally ${entry.tally})`}: ${modeLabel(entry.dicePerPlayer)}, ${playersText(entry.players)}`,
                }))}
              />
            )}
            <label className="flex min-h-11 items-start gap-2">
              <input
                type="checkbox"
                className="mt-1 h-5 w-5 accent-tide"
                checked={createGroups}
                onChange={(event) => {
                  setCreateGroups(event.target.checked);
                  reset();
                }}
              />
              <span>
                <span className="font-bold">Create groups that are new</span>
                <span className="block text-sm text-ink-soft">
                  Without this, a nickname the run does not know is an error (often a typing slip). Known groups:{" "}
                  {results.data.groups.length > 0 ? results.data.groups.map((group) => group.nickname).join(", ") : "none yet"}.
                </span>
              </span>
            </label>
            <div className="flex flex-wrap gap-2">
              <Button type="submit" disabled={!file || tooLarge} busy={preview.isPending}>
                Check the file
              </Button>
              {file && (
                <Button
                  type="button"
                  variant="quiet"
                  onClick={() => {
                    setFile(null);
                    setFileKey((key) => key + 1);
                    reset();
                  }}
                >
                  Choose another file
                </Button>
              )}
            </div>
          </form>

          {preview.error && (
            <div className="mb-4">
              <Alert tone="error" title="The file could not be checked">
                {preview.error.message}
              </Alert>
            </div>
          )}
          {commit.error && (
            <div className="mb-4">
              <Alert tone="error" title="Nothing was imported">
                {commit.error.message}
              </Alert>
            </div>
          )}
          {imported && (
            <div className="mb-4">
              <Alert tone="info" title={imported.imported ? "Imported" : "Nothing new to import"}>
                {imported.imported
                  ? `${plural(imported.newRows, "new roll")} stored${imported.duplicateRows > 0 ? `; ${plural(imported.duplicateRows, "row")} already stored from an earlier upload were left as they were` : ""}.`
                  : `This file was imported before${imported.alreadyImportedAt ? ` (${dayText(imported.alreadyImportedAt)})` : ""}, so no roll was added twice.`}
                {imported.newGroups.length > 0 && imported.imported && ` New groups: ${imported.newGroups.join(", ")}.`}{" "}
                <Link to={`/app/results/${run.id}`} className="font-bold underline">
                  See the results
                </Link>
              </Alert>
            </div>
          )}
          {checked && <PreviewPanel result={checked} busy={commit.isPending} onImport={importRows} />}
        </div>

        <aside className="min-w-0" aria-label="The Paper import format">
          <h2 className="mb-2 text-2xl">The format</h2>
          <p className="mb-3 text-ink-soft">The same columns, in the same order, as the recording sheets printed from the Dice bench.</p>
          <dl className="mb-4 grid gap-2 rounded-2xl border-2 border-line bg-shell p-4">
            {paperImportColumns.map((column) => (
              <div key={column}>
                <dt className="font-mono font-bold">{column}</dt>
                <dd className="text-sm">{paperImportColumnHelp[column]}</dd>
              </div>
            ))}
          </dl>
          <h3 className="mb-1 text-lg">An example for this run</h3>
          <pre className="mb-2 overflow-x-auto rounded-xl bg-ink p-3 text-sm text-sand">{example}</pre>
          {templateUrl && (
            <a
              href={templateUrl}
              download={`paper-import-${run.classGroup || "run"}.csv`}
              className="font-bold text-tide-dark underline underline-offset-2"
            >
              ⤓ Download this example as a CSV to fill in
            </a>
          )}
          <div className="mt-6">
            <PupilDataNote />
          </div>
        </aside>
      </div>
    </>
  );
}

/** The checked file: every bad row by its number, then the rows that will be stored. */
function PreviewPanel({ result, busy, onImport }: { result: PaperImportResult; busy: boolean; onImport: () => void }) {
  const bad = result.errors.length;
  const shown = result.rows.slice(0, 200);
  return (
    <section aria-labelledby="paper-preview-title" className="flex flex-col gap-4">
      <h2 id="paper-preview-title" className="text-2xl">
        Check of {result.fileName}
      </h2>
      {bad > 0 ? (
        <Alert tone="error" title={`${plural(bad, "row has", "rows have")} problems, so nothing can be imported yet`}>
          <p className="mb-2">Correct these rows in your spreadsheet (row 1 is the header row), save the file and check it again.</p>
          <ul className="flex list-none flex-col gap-1" aria-label="Problems by row">
            {result.errors.map((entry) => (
              <li key={entry.row}>
                <span className="font-bold">Row {entry.row}:</span> {entry.messages.join(" ")}
              </li>
            ))}
          </ul>
        </Alert>
      ) : (
        <Alert tone="info" title={`All ${plural(result.rows.length, "row")} are fine`}>
          {plural(result.newRows, "roll")} will be added
          {result.duplicateRows > 0 &&
            `; ${plural(result.duplicateRows, "row")} ${result.duplicateRows === 1 ? "is" : "are"} already stored and will be left as ${result.duplicateRows === 1 ? "it is" : "they are"}`}
          .{result.newGroups.length > 0 && ` New groups: ${result.newGroups.join(", ")}.`}
          {result.alreadyImportedAt &&
            ` This exact file was imported on ${dayText(result.alreadyImportedAt)}; importing it again adds nothing.`}
        </Alert>
      )}
      {bad === 0 && (
        <div>
          <Button onClick={onImport} busy={busy} disabled={result.newRows === 0 && result.alreadyImportedAt !== null}>
            Import {plural(result.newRows, "roll")}
          </Button>
        </div>
      )}
      {shown.length > 0 && (
        <div className="overflow-x-auto rounded-2xl border-2 border-line bg-shell">
          <table className="w-full border-collapse text-left text-sm">
            <caption className="px-3 pt-3 text-left text-ink-soft">
              Rows that passed the check{result.rows.length > shown.length ? ` (the first ${shown.length} of ${result.rows.length})` : ""}.
            </caption>
            <thead>
              <tr className="border-b-2 border-line">
                <th scope="col" className="px-3 py-2">
                  Row
                </th>
                <th scope="col" className="px-3 py-2">
                  Group
                </th>
                <th scope="col" className="px-3 py-2">
                  Roll
                </th>
                <th scope="col" className="px-3 py-2">
                  Dice and faces
                </th>
                <th scope="col" className="px-3 py-2">
                  Winner
                </th>
                <th scope="col" className="px-3 py-2">
                  Status
                </th>
              </tr>
            </thead>
            <tbody>
              {shown.map((row) => (
                <tr key={row.row} className="border-b border-line last:border-b-0 even:bg-sand/40">
                  <td className="px-3 py-1 tabular-nums">{row.row}</td>
                  <td className="px-3 py-1">
                    {row.group}
                    {row.newGroup && <span className="ml-1 text-ink-soft">(new)</span>}
                  </td>
                  <td className="px-3 py-1 tabular-nums">{row.rollNumber}</td>
                  <td className="px-3 py-1">{row.dieNames.map((name, index) => `${name} ${row.faces[index].join("+")}`).join(" v ")}</td>
                  <td className="px-3 py-1">{row.winner ?? "tie"}</td>
                  <td className="px-3 py-1">{statusWords[row.status]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
