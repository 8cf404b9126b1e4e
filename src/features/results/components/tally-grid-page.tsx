import { useId, useState, type FormEvent, type ReactNode } from "react";
import { Link } from "react-router-dom";
import type { ResultsTally } from "@shared/schemas/results";
import type { StoredTallyCount, TallyGrid } from "@shared/schemas/tally-grid";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { PageHeader } from "@/components/ui/page-header";
import { SelectField } from "@/components/ui/select-field";
import { Tabs } from "@/components/ui/tabs";
import { TextField } from "@/components/ui/text-field";
import { ApiRequestError } from "@/lib/api-client";
import { modeLabel } from "@/lib/probability-text";
import { useTallyGrid } from "../api/get-tally-grid";
import { useSaveTallyCounts } from "../api/save-tally-counts";
import { useSaveTallyRolls } from "../api/save-tally-rolls";
import { playersText, plural } from "./figures";
import { PupilDataNote } from "./pupil-data-note";

/** Rows a group's grid starts with when the run has no lesson to say how many rolls were planned. */
const DEFAULT_ROWS = 20;

const cellInput = "min-h-11 w-full min-w-14 rounded-lg border-2 border-line bg-white px-2 py-1 text-base text-ink";

/** The total of a faces cell ("4" or "3+5"), or null while it is not whole numbers joined by +. */
function totalOf(cell: string): number | null {
  if (!/^\s*-?\d+(\s*\+\s*-?\d+)*\s*$/.test(cell)) return null;
  return cell.split("+").reduce((sum, part) => sum + Number(part.trim()), 0);
}

/** Each refused row's messages, from a 422 answer's fields ("row 3": […]). */
function rowProblems(error: unknown): [string, string[]][] {
  return error instanceof ApiRequestError ? Object.entries(error.fields).filter(([key]) => key.startsWith("row ")) : [];
}

function Problems({ error, title }: { error: Error | null; title: string }) {
  if (!error) return null;
  const rows = rowProblems(error);
  return (
    <Alert tone="error" title={title}>
      <p>{error.message}</p>
      {rows.length > 0 && (
        <ul className="mt-2 list-disc pl-5" data-testid="tally-problems">
          {rows.map(([row, messages]) => (
            <li key={row}>
              <b>{row.replace("row", "Row")}</b>: {messages.join(" ")}
            </li>
          ))}
        </ul>
      )}
    </Alert>
  );
}

/** The tally grid: a teacher types each group's results from its paper sheet, roll by roll or as win/tie/loss counts. */
export function TallyGridPage({ runId }: { runId: string }) {
  const grid = useTallyGrid(runId);
  const [tab, setTab] = useState("rolls");
  const [tallyNumber, setTallyNumber] = useState(1);
  if (grid.isPending) return <p role="status">Loading the run…</p>;
  if (grid.isError) {
    return (
      <Alert tone="error" title="This run could not be loaded">
        {grid.error.message}{" "}
        <Link to="/app/results" className="font-bold underline">
          Back to Results
        </Link>
      </Alert>
    );
  }
  const { run } = grid.data;
  const tally = run.tallies.find((entry) => entry.tally === tallyNumber) ?? run.tallies[0];
  return (
    <>
      <p className="mb-2">
        <Link to={`/app/results/${run.id}`} className="font-bold text-tide-dark underline underline-offset-2">
          ← {run.title}
        </Link>
      </p>
      <PageHeader
        title="Tally grid"
        lead={`Type each group's results from its recording sheet for “${run.title}” (${run.classGroup || "no class"}): ${modeLabel(tally.dicePerPlayer)}, ${playersText(tally.players)}. Rolls typed here and rolls in a Paper import file are the same rolls: nothing is stored twice.`}
      />
      {!run.isOwner && (
        <div className="mb-4">
          <Alert tone="info" title="Read only">
            Only the teacher who ran this class may enter results for it.
          </Alert>
        </div>
      )}
      {run.tallies.length > 1 && (
        <div className="mb-4">
          <ChoiceGroup<string>
            legend="Which part of the lesson the sheets recorded"
            value={String(tally.tally)}
            onChange={(value) => setTallyNumber(Number(value))}
            options={run.tallies.map((entry) => ({
              value: String(entry.tally),
              label: `${entry.tally === 1 ? "The Roll phase" : `Twist tally ${entry.tally}`}: ${modeLabel(entry.dicePerPlayer)}, ${playersText(entry.players)}`,
            }))}
          />
        </div>
      )}
      <Tabs
        label="How the sheets were filled in"
        items={[
          { id: "rolls", label: "Roll by roll" },
          { id: "counts", label: "Counts only (quick lesson)" },
        ]}
        selected={tab}
        onSelect={setTab}
      >
        {tab === "rolls" ? (
          <RollsGrid key={`rolls-${tally.tally}`} grid={grid.data} tally={tally} />
        ) : (
          <CountsGrid key={`counts-${tally.tally}`} grid={grid.data} tally={tally} />
        )}
      </Tabs>
      <div className="mt-8 max-w-3xl">
        <PupilDataNote />
      </div>
    </>
  );
}

/** Datalist of the run's group nicknames, so a nickname is picked rather than typed slightly differently. */
function GroupNames({ id, grid }: { id: string; grid: TallyGrid }) {
  return (
    <datalist id={id}>
      {grid.groups.map((group) => (
        <option key={group.id} value={group.nickname} />
      ))}
    </datalist>
  );
}

const isKnownGroup = (grid: TallyGrid, nickname: string) =>
  grid.groups.some((group) => group.nickname.trim().toLowerCase() === nickname.trim().toLowerCase());

/** One group's sheet, typed roll by roll: its dice, then one line per roll with the faces each player rolled. */
function RollsGrid({ grid, tally }: { grid: TallyGrid; tally: ResultsTally }) {
  const save = useSaveTallyRolls();
  const names = grid.run.dieNames;
  const listId = useId();
  const [nickname, setNickname] = useState("");
  const [dice, setDice] = useState<string[]>(() => Array.from({ length: tally.players }, (_, seat) => names[seat % names.length]));
  const [rows, setRows] = useState<string[][]>(() =>
    Array.from({ length: grid.plannedRolls ?? DEFAULT_ROWS }, () => Array.from({ length: tally.players }, () => "")),
  );
  const [createGroup, setCreateGroup] = useState(false);
  const known = isKnownGroup(grid, nickname);
  const filled = rows.map((faces, index) => ({ faces, roll: index + 1 })).filter((row) => row.faces.some((cell) => cell.trim() !== ""));
  const facesHint = tally.dicePerPlayer === 1 ? "the face rolled" : `the ${tally.dicePerPlayer} faces joined by +, e.g. 3+5`;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    save.mutate({
      runId: grid.run.id,
      input: {
        tally: tally.tally,
        createGroups: !known && createGroup,
        rows: filled.map((row) => ({
          group: nickname,
          roll: String(row.roll),
          die_1: dice[0],
          faces_1: row.faces[0],
          die_2: dice[1],
          faces_2: row.faces[1],
          die_3: tally.players === 3 ? dice[2] : "",
          faces_3: tally.players === 3 ? row.faces[2] : "",
        })),
      },
    });
  };
  const setCell = (rowIndex: number, seat: number, value: string) => {
    save.reset();
    setRows((current) =>
      current.map((faces, index) => (index === rowIndex ? faces.map((cell, position) => (position === seat ? value : cell)) : faces)),
    );
  };

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" aria-label="Rolls of one group">
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <TextField
          label="Group nickname"
          list={listId}
          value={nickname}
          maxLength={24}
          onChange={(event) => setNickname(event.target.value)}
          hint="As written at the top of the sheet."
        />
        <GroupNames id={listId} grid={grid} />
        {dice.map((die, seat) => (
          <SelectField
            key={seat}
            label={`Player ${seat + 1}'s die`}
            value={die}
            onChange={(event) => setDice((current) => current.map((name, position) => (position === seat ? event.target.value : name)))}
            options={names.map((name) => ({ value: name, label: name }))}
          />
        ))}
      </div>
      {nickname.trim() !== "" && !known && (
        <label className="flex min-h-11 items-center gap-2">
          <input
            type="checkbox"
            className="h-5 w-5 accent-tide"
            checked={createGroup}
            onChange={(event) => setCreateGroup(event.target.checked)}
          />
          “{nickname.trim()}” is a new group in this run: create it
        </label>
      )}
      <p className="text-sm text-ink-soft">
        For each roll, type {facesHint} for each player. Leave the lines of rolls not made empty.{" "}
        {grid.plannedRolls !== null && `The lesson planned ${grid.plannedRolls} rolls per group.`}
      </p>
      <div className="max-w-full overflow-x-auto rounded-xl border-2 border-line bg-shell" role="region" aria-label="Rolls" tabIndex={0}>
        <table className="w-full border-collapse text-left" data-testid="tally-rolls">
          <thead>
            <tr className="border-b-2 border-line">
              <th scope="col" className="p-2">
                Roll
              </th>
              {dice.map((die, seat) => (
                <th key={seat} scope="col" className="p-2">
                  {die} rolled
                </th>
              ))}
              <th scope="col" className="p-2">
                Winner
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((faces, rowIndex) => {
              const totals = faces.map(totalOf);
              const complete = totals.every((total) => total !== null);
              const highest = complete ? Math.max(...(totals as number[])) : null;
              const top = complete ? totals.filter((total) => total === highest).length : 0;
              const winner = complete ? (top > 1 ? "tie" : dice[totals.indexOf(highest!)]) : "";
              return (
                <tr key={rowIndex} className="border-b border-line/60">
                  <th scope="row" className="p-2 font-normal">
                    {rowIndex + 1}
                  </th>
                  {faces.map((cell, seat) => (
                    <td key={seat} className="p-1">
                      <input
                        className={cellInput}
                        inputMode={tally.dicePerPlayer === 1 ? "numeric" : "text"}
                        aria-label={`Roll ${rowIndex + 1}: ${dice[seat]} rolled`}
                        value={cell}
                        onChange={(event) => setCell(rowIndex, seat, event.target.value)}
                      />
                    </td>
                  ))}
                  <td className="p-2 font-bold">{winner}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" busy={save.isPending} disabled={!grid.run.isOwner || nickname.trim() === "" || filled.length === 0}>
          Save {plural(filled.length, "roll")}
        </Button>
        <Button
          type="button"
          variant="secondary"
          onClick={() =>
            setRows((current) => [...current, ...Array.from({ length: 5 }, () => Array.from({ length: tally.players }, () => ""))])
          }
        >
          Add 5 lines
        </Button>
      </div>
      <Problems error={save.error} title="Nothing was saved" />
      {save.data && (
        <Alert tone="info" title="Saved">
          <span data-testid="tally-rolls-saved">
            {save.data.imported ? `${plural(save.data.newRows, "new roll")} stored` : "No new rolls"}
            {save.data.duplicateRows > 0 && `; ${plural(save.data.duplicateRows, "roll")} already stored and left as they were`}.
          </span>
        </Alert>
      )}
    </form>
  );
}

type CountLine = { group: string; first: string; second: string; firstWins: string; ties: string; secondWins: string };

function lineOf(stored: StoredTallyCount): CountLine {
  return {
    group: stored.group,
    first: stored.dice[0],
    second: stored.dice[1],
    firstWins: String(stored.firstWins),
    ties: String(stored.ties),
    secondWins: String(stored.secondWins),
  };
}

/** A whole number from 0 typed into a count cell; empty counts as 0; null while it is anything else. */
function countOf(text: string): number | null {
  if (text.trim() === "") return 0;
  const value = Number(text);
  return Number.isInteger(value) && value >= 0 ? value : null;
}

/** A quick lesson's counts: one line per group and matchup with the first die's wins, the ties and the second die's wins. */
function CountsGrid({ grid, tally }: { grid: TallyGrid; tally: ResultsTally }) {
  const save = useSaveTallyCounts();
  const names = grid.run.dieNames;
  const listId = useId();
  const blank = (): CountLine => ({ group: "", first: names[0], second: names[1] ?? names[0], firstWins: "", ties: "", secondWins: "" });
  const stored = grid.counts.filter((entry) => entry.tally === tally.tally).map(lineOf);
  const [lines, setLines] = useState<CountLine[]>(stored.length > 0 ? stored : [blank()]);
  const [createGroups, setCreateGroups] = useState(false);
  if (tally.players !== 2) {
    return (
      <Alert tone="info" title="Counts are for two players">
        With three players, counts cannot say which players tied; type these sheets roll by roll instead.
      </Alert>
    );
  }
  const newGroups = [...new Set(lines.map((line) => line.group.trim()).filter((group) => group !== "" && !isKnownGroup(grid, group)))];
  const badCell = lines.some((line) => [line.firstWins, line.ties, line.secondWins].some((cell) => countOf(cell) === null));
  const update = (index: number, change: Partial<CountLine>) => {
    save.reset();
    setLines((current) => current.map((line, position) => (position === index ? { ...line, ...change } : line)));
  };
  const submit = (event: FormEvent) => {
    event.preventDefault();
    save.mutate(
      {
        runId: grid.run.id,
        input: {
          tally: tally.tally,
          createGroups,
          counts: lines
            .filter((line) => line.group.trim() !== "")
            .map((line) => ({
              group: line.group.trim(),
              dice: [line.first, line.second] as [string, string],
              firstWins: countOf(line.firstWins) ?? 0,
              ties: countOf(line.ties) ?? 0,
              secondWins: countOf(line.secondWins) ?? 0,
            })),
        },
      },
      // Show the lines as stored: empty lines dropped, each matchup from the lower-listed die's side.
      { onSuccess: (result) => setLines(result.counts.filter((entry) => entry.tally === tally.tally).map(lineOf)) },
    );
  };
  const dieOptions = names.map((name) => ({ value: name, label: name }));
  return (
    <form onSubmit={submit} className="flex flex-col gap-4" aria-label="Counts of each group">
      <p className="text-ink-soft">
        For a quick lesson where groups only kept a tally: one line per group and matchup. Counts go into every total, frequency and
        interval, but they have no order, so they add nothing to the convergence chart and have no lines in the rolls download; the summary
        download marks them. Saving replaces this part of the lesson's counts.
      </p>
      <GroupNames id={listId} grid={grid} />
      <ol className="flex flex-col gap-2" data-testid="tally-counts">
        {lines.map((line, index) => {
          const label = `Line ${index + 1}`;
          const cell = (caption: string, control: ReactNode, wide = false) => (
            <label className={`flex min-w-0 flex-col gap-0.5 ${wide ? "col-span-2 sm:col-span-1" : ""}`}>
              <span className="text-xs font-bold text-ink-soft" aria-hidden="true">
                {caption}
              </span>
              {control}
            </label>
          );
          return (
            <li
              key={index}
              className="grid grid-cols-2 items-end gap-2 rounded-xl border-2 border-line bg-shell p-2 sm:grid-cols-[minmax(8rem,2fr)_repeat(2,minmax(6rem,1.5fr))_repeat(3,minmax(4rem,1fr))_auto]"
            >
              {cell(
                "Group",
                <input
                  className={cellInput}
                  list={listId}
                  maxLength={24}
                  aria-label={`${label}: group`}
                  value={line.group}
                  onChange={(event) => update(index, { group: event.target.value })}
                />,
                true,
              )}
              {cell(
                "Die",
                <select
                  className={cellInput}
                  aria-label={`${label}: die`}
                  value={line.first}
                  onChange={(event) => update(index, { first: event.target.value })}
                >
                  {dieOptions.map((option) => (
                    <option key={option.value} value={option.value}>
                      {option.label}
                    </option>
                  ))}
                </select>,
              )}
              {cell(
                "Against",
                <select
                  className={cellInput}
                  aria-label={`${label}: against`}
                  value={line.second}
                  onChange={(event) => update(index, { second: event.target.value })}
                >
                  {dieOptions.map((option) => (
                    <option key={option.value} value={option.value}>
                      {option.label}
                    </option>
                  ))}
                </select>,
              )}
              {(["firstWins", "ties", "secondWins"] as const).map((field) => {
                const caption = field === "firstWins" ? `${line.first} won` : field === "ties" ? "Ties" : `${line.second} won`;
                return (
                  <span key={field} className="contents">
                    {cell(
                      caption,
                      <input
                        className={`${cellInput} ${countOf(line[field]) === null ? "border-alarm" : ""}`}
                        inputMode="numeric"
                        aria-label={`${label}: ${field === "ties" ? "ties" : caption}`}
                        value={line[field]}
                        onChange={(event) => update(index, { [field]: event.target.value })}
                      />,
                    )}
                  </span>
                );
              })}
              <Button
                type="button"
                variant="quiet"
                aria-label={`Remove line ${index + 1}`}
                onClick={() => setLines((current) => current.filter((_, position) => position !== index))}
              >
                ✕
              </Button>
            </li>
          );
        })}
      </ol>
      {badCell && <p className="font-bold text-alarm">Counts are whole numbers from 0; fix the boxes marked red.</p>}
      {newGroups.length > 0 && (
        <label className="flex min-h-11 items-center gap-2">
          <input
            type="checkbox"
            className="h-5 w-5 accent-tide"
            checked={createGroups}
            onChange={(event) => setCreateGroups(event.target.checked)}
          />
          Create {newGroups.length === 1 ? "the new group" : "the new groups"} {newGroups.map((group) => `“${group}”`).join(", ")}
        </label>
      )}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" busy={save.isPending} disabled={!grid.run.isOwner || badCell}>
          Save counts
        </Button>
        <Button type="button" variant="secondary" onClick={() => setLines((current) => [...current, blank()])}>
          Add a line
        </Button>
      </div>
      <Problems error={save.error} title="Nothing was saved" />
      {save.data && (
        <Alert tone="info" title="Saved">
          <span data-testid="tally-counts-saved">
            {plural(save.data.saved, "line")} of counts stored
            {save.data.newGroups.length > 0 && `; new groups: ${save.data.newGroups.join(", ")}`}.
          </span>
        </Alert>
      )}
    </form>
  );
}
