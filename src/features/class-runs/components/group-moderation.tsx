import { useEffect, useRef, useState, type FormEvent } from "react";
import { nicknameProblem, type BoardGroup, type ClassRun } from "@shared/schemas/class-runs";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { useRemoveGroup, useRenameGroup, useSetGroupLeftOut } from "../api/moderate-group";

/** What the board marks beside a group's nickname: left out of the figures, and a phone that sent rolls too fast. */
export function GroupStateMarks({ group }: { group: BoardGroup }) {
  return (
    <>
      {group.leftOut && (
        <span
          className="mt-1 block w-fit rounded-lg border-2 border-line bg-white px-2 text-sm font-bold text-ink-soft"
          data-testid="left-out-mark"
        >
          Left out of the figures
        </span>
      )}
      {group.floodedAt && (
        <span
          className="mt-1 block w-fit rounded-lg border-2 border-beacon bg-beacon-light px-2 text-sm font-bold"
          data-testid="flood-mark"
        >
          <span aria-hidden="true">⚑ </span>Sent rolls too fast at{" "}
          {new Date(group.floodedAt).toLocaleTimeString("en-GB", { timeStyle: "short" })}
        </span>
      )}
    </>
  );
}

/** The teacher's moderation of one group: rename it, leave its rolls out (or count them again), remove it. */
export function GroupActions({ run, group }: { run: ClassRun; group: BoardGroup }) {
  const rename = useRenameGroup(run.id);
  const leaveOut = useSetGroupLeftOut(run.id);
  const remove = useRemoveGroup(run.id);
  const [renaming, setRenaming] = useState(false);
  const [nickname, setNickname] = useState(group.nickname);
  const [removing, setRemoving] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const nicknameField = useRef<HTMLInputElement>(null);
  // The new nickname's field takes the focus when the teacher chooses to rename.
  useEffect(() => {
    if (renaming) nicknameField.current?.focus();
  }, [renaming]);
  if (run.status === "closed") return <span className="text-ink-soft">–</span>;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const refused = nicknameProblem(nickname);
    if (refused) {
      setProblem(refused);
      return;
    }
    setProblem(null);
    rename.mutate({ runId: run.id, groupId: group.id, nickname }, { onSuccess: () => setRenaming(false) });
  };
  const error = problem ?? (rename.error ?? leaveOut.error ?? remove.error)?.message ?? null;

  return (
    <div className="flex flex-col gap-2">
      {renaming ? (
        <form className="flex flex-wrap items-end gap-2" onSubmit={submit}>
          <label className="flex flex-col text-sm font-bold">
            New nickname for {group.nickname}
            <input
              className="min-h-11 rounded-lg border-2 border-line bg-white px-2 text-base font-normal"
              value={nickname}
              maxLength={40}
              ref={nicknameField}
              onChange={(event) => setNickname(event.target.value)}
            />
          </label>
          <Button type="submit" busy={rename.isPending}>
            Save
          </Button>
          <Button type="button" variant="secondary" onClick={() => (setRenaming(false), setProblem(null), setNickname(group.nickname))}>
            Cancel
          </Button>
        </form>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => setRenaming(true)} aria-label={`Rename ${group.nickname}`}>
            Rename
          </Button>
          <Button
            variant="secondary"
            busy={leaveOut.isPending}
            aria-label={`${group.leftOut ? "Count again" : "Leave out"} ${group.nickname}`}
            onClick={() => leaveOut.mutate({ runId: run.id, groupId: group.id, leftOut: !group.leftOut })}
          >
            {group.leftOut ? "Count again" : "Leave out"}
          </Button>
          <Button variant="danger" onClick={() => setRemoving(true)} aria-label={`Remove ${group.nickname}`}>
            Remove
          </Button>
        </div>
      )}
      {error && (
        <p role="alert" className="text-sm font-bold text-alarm">
          {error}
        </p>
      )}
      <ConfirmDialog
        open={removing}
        title={`Remove “${group.nickname}” from the run?`}
        confirmLabel="Remove the group"
        busy={remove.isPending}
        onCancel={() => setRemoving(false)}
        onConfirm={() => remove.mutate({ runId: run.id, groupId: group.id }, { onSettled: () => setRemoving(false) })}
      >
        The group leaves the board and every figure, and its phone can record no more. Its rolls stay stored, unseen. To keep the group
        playing but not counted, choose Leave out instead.
      </ConfirmDialog>
    </div>
  );
}
