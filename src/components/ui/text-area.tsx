import { forwardRef, type TextareaHTMLAttributes } from "react";
import { controlBorder, FieldFrame } from "./field-frame";

type TextAreaProps = TextareaHTMLAttributes<HTMLTextAreaElement> & { label: string; hint?: string; error?: string };

/** A labelled multi-line input whose hint and error are tied to it for screen readers. */
export const TextArea = forwardRef<HTMLTextAreaElement, TextAreaProps>(function TextArea(
  { label, hint, error, className = "", id, rows = 3, ...props },
  ref,
) {
  return (
    <FieldFrame id={id} label={label} hint={hint} error={error} className={className}>
      {(control) => (
        <textarea
          ref={ref}
          {...control}
          rows={rows}
          className={`w-full min-w-0 rounded-lg border-2 bg-white px-3 py-2 text-base text-ink ${controlBorder(error)}`}
          {...props}
        />
      )}
    </FieldFrame>
  );
});
