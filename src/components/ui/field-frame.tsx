import { useId, type ReactNode } from "react";

export type FieldControlProps = {
  id: string;
  "aria-invalid": true | undefined;
  "aria-describedby": string | undefined;
};

/** The border of a form control, red when it carries an error. */
export function controlBorder(error?: string) {
  return error ? "border-alarm" : "border-line focus:border-tide";
}

/**
 * A label, an optional hint and an optional error around one form control, tied to it for screen readers;
 * `children` receives the id and ARIA attributes to spread on the control.
 */
export function FieldFrame({
  id,
  label,
  hint,
  error,
  className = "",
  children,
}: {
  id?: string;
  label: string;
  hint?: string;
  error?: string;
  className?: string;
  children: (control: FieldControlProps) => ReactNode;
}) {
  const autoId = useId();
  const controlId = id ?? autoId;
  const hintId = hint ? `${controlId}-hint` : undefined;
  const errorId = error ? `${controlId}-error` : undefined;
  return (
    <div className={`flex min-w-0 flex-col gap-1 ${className}`}>
      <label htmlFor={controlId} className="font-bold">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      )}
      {children({
        id: controlId,
        "aria-invalid": error ? true : undefined,
        "aria-describedby": [hintId, errorId].filter(Boolean).join(" ") || undefined,
      })}
      {error && (
        <p id={errorId} className="text-sm font-bold text-alarm">
          {error}
        </p>
      )}
    </div>
  );
}
