import { useEffect, useRef, useState } from "react";
import { useNavigate } from "react-router-dom";
import type { DiceSet } from "@shared/schemas/dice-sets";
import { DieSwatch } from "@/components/dice/die-swatch";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { useDeleteDiceSet } from "../api/delete-dice-set";
import { useDuplicateDiceSet } from "../api/duplicate-dice-set";
import { useDiceSets } from "../api/list-dice-sets";
import { ImportSetFile } from "./import-set-file";

/** The Dice bench's start: the teacher's own sets and those colleagues share, with new, duplicate, delete and import. */
export function DiceSetList() {
  const sets = useDiceSets();
  const own = sets.data?.sets.filter((set) => set.isOwner) ?? [];
  const shared = sets.data?.sets.filter((set) => !set.isOwner) ?? [];
  return (
    <>
      <PageHeader
        title="Dice bench"
        lead="Build a dice set and read its exact analysis: matchups, beats graph, tree diagrams, Pick advisor and Series planner."
        actions={
          <LinkButton to="/app/bench/new" variant="primary">
            + New dice set
          </LinkButton>
        }
      />
      {sets.isPending && <p role="status">Loading your dice sets…</p>}
      {sets.isError && (
        <Alert tone="error" title="Your dice sets could not be loaded">
          {sets.error.message}
        </Alert>
      )}
      {sets.data && (
        <div className="flex flex-col gap-8">
          <SetGroup
            title="Your dice sets"
            sets={own}
            empty="You have no dice sets yet. Start a new one, duplicate a colleague's, or import a set file."
          />
          <SetGroup title="Shared by colleagues" sets={shared} empty="No colleague shares a dice set with the department yet." />
          <ImportSetFile />
        </div>
      )}
    </>
  );
}

function SetGroup({ title, sets, empty }: { title: string; sets: DiceSet[]; empty: string }) {
  const id = title.toLowerCase().replace(/\W+/g, "-");
  return (
    <section aria-labelledby={id}>
      <h2 id={id} className="mb-3 text-2xl">
        {title}
      </h2>
      {sets.length === 0 ? (
        <p className="text-ink-soft">{empty}</p>
      ) : (
        <ul className="grid gap-3 md:grid-cols-2 xl:grid-cols-3">
          {sets.map((set) => (
            <SetCard key={set.id} set={set} />
          ))}
        </ul>
      )}
    </section>
  );
}

function SetCard({ set }: { set: DiceSet }) {
  const navigate = useNavigate();
  const duplicate = useDuplicateDiceSet();
  const remove = useDeleteDiceSet();
  const [confirming, setConfirming] = useState(false);
  const keepIt = useRef<HTMLButtonElement>(null);
  // The question takes the focus when it opens, on the safe answer.
  useEffect(() => {
    if (confirming) keepIt.current?.focus();
  }, [confirming]);
  const headingId = `set-${set.id}`;
  return (
    <li className="flex min-w-0 flex-col gap-3 rounded-2xl border-2 border-line bg-shell p-4" aria-labelledby={headingId}>
      <div className="min-w-0">
        <h3 id={headingId} className="break-words text-xl">
          {set.name}
        </h3>
        <p className="text-sm text-ink-soft">
          {set.dice.length} dice ·{" "}
          {set.isOwner ? (set.visibility === "department" ? "shared with the department" : "only you") : `shared by ${set.ownerName}`}
        </p>
      </div>
      <ul className="flex flex-wrap gap-x-3 gap-y-1" aria-label={`Dice of ${set.name}`}>
        {set.dice.map((die) => (
          <li key={die.name} className="flex items-center gap-1.5 text-sm">
            <DieSwatch colour={die.colour} pattern={die.pattern} className="h-5 w-5" />
            {die.name}
          </li>
        ))}
      </ul>
      {set.description && <p className="line-clamp-2 text-ink-soft">{set.description}</p>}
      <div className="mt-auto flex flex-wrap gap-2">
        <LinkButton to={`/app/bench/${set.id}`} aria-label={`Open ${set.name}`}>
          Open
        </LinkButton>
        <Button
          variant="secondary"
          busy={duplicate.isPending}
          aria-label={`Duplicate ${set.name}`}
          onClick={() =>
            duplicate.mutate(set.id, {
              onSuccess: (copy) => navigate(`/app/bench/${copy.id}`, { state: { notice: "Duplicated: this copy is yours to edit." } }),
            })
          }
        >
          Duplicate
        </Button>
        {set.isOwner && !confirming && (
          <Button variant="quiet" className="text-alarm!" aria-label={`Delete ${set.name}`} onClick={() => setConfirming(true)}>
            Delete
          </Button>
        )}
      </div>
      {confirming && (
        <div role="alertdialog" aria-labelledby={`${headingId}-confirm`} className="rounded-xl border-2 border-alarm bg-alarm-light p-3">
          <p id={`${headingId}-confirm`} className="font-bold">
            Delete &ldquo;{set.name}&rdquo;? This cannot be undone.
          </p>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button variant="danger" busy={remove.isPending} onClick={() => remove.mutate(set.id)}>
              Yes, delete it
            </Button>
            <Button variant="secondary" ref={keepIt} onClick={() => setConfirming(false)}>
              Keep it
            </Button>
          </div>
        </div>
      )}
      {(duplicate.error || remove.error) && (
        <Alert tone="error" title="That did not work">
          {(duplicate.error ?? remove.error)?.message}
        </Alert>
      )}
    </li>
  );
}
