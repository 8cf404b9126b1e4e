import { useId, type ReactNode } from "react";

/**
 * A labelled group of radio buttons drawn as pills; the chosen one is marked by a tick as well as by colour. A `null`
 * value leaves every option unchosen (a decision the user must make); `error` is said beside the legend.
 */
export function ChoiceGroup<T extends string>({
  legend,
  value,
  options,
  onChange,
  hint,
  error,
  className = "",
}: {
  legend: string;
  value: T | null;
  options: { value: T; label: ReactNode }[];
  onChange: (value: T) => void;
  hint?: string;
  error?: string;
  className?: string;
}) {
  const name = useId();
  const errorId = useId();
  return (
    <fieldset className={`min-w-0 ${className}`} aria-describedby={error ? errorId : undefined}>
      <legend className="mb-1 font-bold">{legend}</legend>
      {hint && <p className="mb-1 text-sm text-ink-soft">{hint}</p>}
      {error && (
        <p id={errorId} className="mb-1 text-sm font-bold text-alarm">
          {error}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        {options.map((option) => {
          const checked = option.value === value;
          return (
            <label
              key={option.value}
              className={`inline-flex min-h-11 cursor-pointer items-center gap-2 rounded-xl border-2 px-3 py-1.5 font-bold has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-beacon ${
                checked ? "border-tide bg-tide-light text-ink" : "border-line bg-white text-ink-soft hover:border-ink/40"
              }`}
            >
              <input
                type="radio"
                className="sr-only"
                name={name}
                value={option.value}
                checked={checked}
                onChange={() => onChange(option.value)}
              />
              <span aria-hidden="true" className={`inline-block w-3 text-tide ${checked ? "" : "invisible"}`}>
                ✓
              </span>
              {option.label}
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}
