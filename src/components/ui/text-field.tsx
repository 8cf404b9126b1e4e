import { forwardRef, type InputHTMLAttributes } from "react";
import { controlBorder, FieldFrame } from "./field-frame";

type TextFieldProps = InputHTMLAttributes<HTMLInputElement> & { label: string; hint?: string; error?: string };

/** A labelled input whose hint and error are tied to it for screen readers. */
export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField(
  { label, hint, error, className = "", id, ...props },
  ref,
) {
  return (
    <FieldFrame id={id} label={label} hint={hint} error={error} className={className}>
      {(control) => (
        <input
          ref={ref}
          {...control}
          className={`min-h-11 rounded-lg border-2 bg-white px-3 py-2 text-base text-ink ${controlBorder(error)}`}
          {...props}
        />
      )}
    </FieldFrame>
  );
});
