import { useId, useRef, useState } from "react";
import { useNavigate } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { ApiRequestError } from "@/lib/api-client";
import { useImportDiceSet } from "../api/import-dice-set";

/** Upload a dice set file: the server checks it; a refused file lists what is wrong and nothing is stored. */
export function ImportSetFile() {
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const navigate = useNavigate();
  const importSet = useImportDiceSet();
  const [localIssues, setLocalIssues] = useState<string[] | null>(null);

  const choose = async (file: File | undefined) => {
    setLocalIssues(null);
    importSet.reset();
    if (!file) return;
    let content: unknown;
    try {
      content = JSON.parse(await file.text());
    } catch (error) {
      setLocalIssues([`“${file.name}” is not a JSON file Outroll can read: ${(error as Error).message}`]);
      return;
    } finally {
      if (input.current) input.current.value = "";
    }
    if (content === null || typeof content !== "object") {
      setLocalIssues([`“${file.name}” must hold one JSON object with format, version, name and dice.`]);
      return;
    }
    importSet.mutate(content, {
      onSuccess: (set) => navigate(`/app/bench/${set.id}`, { state: { notice: `Imported from ${file.name}.` } }),
    });
  };

  const error = importSet.error;
  const issues = localIssues ?? (error instanceof ApiRequestError && error.issues.length > 0 ? error.issues : null);
  return (
    <section aria-labelledby={`${inputId}-heading`} className="flex flex-col gap-2 rounded-xl border-2 border-line bg-shell p-4">
      <h2 id={`${inputId}-heading`} className="text-xl">
        Import a set file
      </h2>
      <p className="text-ink-soft">
        A file downloaded from Outroll (.outroll-dice.json). The imported set is private to you until you share it.
      </p>
      <label
        htmlFor={inputId}
        className="inline-flex min-h-11 w-fit cursor-pointer items-center rounded-xl border-2 border-ink/20 bg-white px-4 py-2 font-bold hover:border-ink/50 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-beacon"
      >
        Choose a set file…
        <input
          ref={input}
          id={inputId}
          type="file"
          accept=".json,application/json"
          className="sr-only"
          onChange={(event) => choose(event.target.files?.[0])}
          aria-label="Set file to import"
        />
      </label>
      {importSet.isPending && <p role="status">Checking the file…</p>}
      {(issues || error) && (
        <Alert tone="error" title="Not imported: nothing was changed">
          {error && !localIssues && <p>{error.message}</p>}
          {issues && (
            <ul className="mt-1 list-disc pl-5" data-testid="import-issues">
              {issues.map((issue) => (
                <li key={issue} className="break-words">
                  {issue}
                </li>
              ))}
            </ul>
          )}
        </Alert>
      )}
    </section>
  );
}
