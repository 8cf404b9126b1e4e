import { useId } from "react";
import {
  curriculumFrameworkNames,
  curriculumStandardByCode,
  curriculumStandards,
  type CurriculumFramework,
} from "@shared/curriculum/standards";

const frameworks = Object.keys(curriculumFrameworkNames) as CurriculumFramework[];

/** Picks a published standard for an objective (or none); the chosen standard's summary is shown in our own words. */
export function CurriculumPicker({
  value,
  onChange,
  label,
  error,
  disabled,
}: {
  value: string | undefined;
  onChange: (code: string | undefined) => void;
  label: string;
  error?: string;
  disabled?: boolean;
}) {
  const id = useId();
  const chosen = value ? curriculumStandardByCode(value) : undefined;
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="font-bold">
        {label}
      </label>
      <select
        id={id}
        value={value ?? ""}
        disabled={disabled}
        onChange={(event) => onChange(event.target.value === "" ? undefined : event.target.value)}
        aria-describedby={chosen ? `${id}-summary` : undefined}
        aria-invalid={error ? true : undefined}
        className={`min-h-11 w-full min-w-0 rounded-lg border-2 bg-white px-3 py-2 text-base text-ink ${error ? "border-alarm" : "border-line focus:border-tide"}`}
      >
        <option value="">No curriculum reference</option>
        {frameworks.map((framework) => (
          <optgroup key={framework} label={curriculumFrameworkNames[framework]}>
            {curriculumStandards
              .filter((standard) => standard.framework === framework)
              .map((standard) => (
                <option key={standard.code} value={standard.code}>
                  {standard.label} · {standard.summary.length > 70 ? `${standard.summary.slice(0, 68)}…` : standard.summary}
                </option>
              ))}
          </optgroup>
        ))}
      </select>
      {chosen && (
        <p id={`${id}-summary`} className="text-sm text-ink-soft">
          <b>{chosen.label}</b> ({curriculumFrameworkNames[chosen.framework]}): {chosen.summary}
        </p>
      )}
      {error && <p className="text-sm font-bold text-alarm">{error}</p>}
    </div>
  );
}
