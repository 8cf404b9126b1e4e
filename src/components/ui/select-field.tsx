import { forwardRef, type SelectHTMLAttributes } from "react";
import { controlBorder, FieldFrame } from "./field-frame";

type SelectFieldProps = SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  hint?: string;
  error?: string;
  options: { value: string; label: string }[];
};

/** A labelled drop-down whose hint and error are tied to it for screen readers. */
export const SelectField = forwardRef<HTMLSelectElement, SelectFieldProps>(function SelectField(
  { label, hint, error, options, className = "", id, ...props },
  ref,
) {
  return (
    <FieldFrame id={id} label={label} hint={hint} error={error} className={className}>
      {(control) => (
        <select
          ref={ref}
          {...control}
          className={`min-h-11 w-full min-w-0 rounded-lg border-2 bg-white px-3 py-2 text-base text-ink ${controlBorder(error)}`}
          {...props}
        >
          {options.map((option) => (
            <option key={option.value} value={option.value}>
              {option.label}
            </option>
          ))}
        </select>
      )}
    </FieldFrame>
  );
});
