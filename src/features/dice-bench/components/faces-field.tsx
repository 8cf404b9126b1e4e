import { useId, useState } from "react";
import { FACES_MAX } from "@shared/probability/index";

export type FacesEntry = "list" | "boxes";

/** Splits typed faces on commas, semicolons and spaces; a token that is not a plain number becomes NaN, which the schema names. */
export function facesFromText(text: string): { faces: number[]; tokens: string[] } {
  const tokens = text.split(/[\s,;]+/).filter((token) => token !== "");
  return { faces: tokens.map((token) => (/^[+-]?\d+(\.\d+)?$/.test(token) ? Number(token) : Number.NaN)), tokens };
}

function facesToText(faces: number[]): string {
  return faces.map((face) => (Number.isNaN(face) ? "?" : String(face))).join(", ");
}

function sameFaces(a: number[], b: number[]) {
  return a.length === b.length && a.every((face, index) => Object.is(face, b[index]));
}

type FaceErrors = { message?: string; root?: { message?: string }; [index: number]: { message?: string } | undefined } | undefined;

/** One line per problem with a die's faces: the whole list first, then each bad face by its position (and what was typed). */
export function faceErrorMessages(error: FaceErrors, faces: number[], tokens?: string[]): string[] {
  if (!error) return [];
  const messages: string[] = [];
  const whole = error.message ?? error.root?.message;
  if (whole) messages.push(whole);
  faces.forEach((_, index) => {
    const message = error[index]?.message;
    if (!message) return;
    const typed = tokens?.[index];
    messages.push(`Face ${index + 1}${typed !== undefined ? ` (“${typed}”)` : ""}: ${message}`);
  });
  return messages;
}

/** A die's faces, typed as one list ("1, 4, 4, 4") or in one box per face; what the teacher types is kept while it is invalid. */
export function FacesField({
  dieLabel,
  faces,
  onChange,
  onBlur,
  entry,
  error,
}: {
  dieLabel: string;
  faces: number[];
  onChange: (faces: number[]) => void;
  onBlur: () => void;
  entry: FacesEntry;
  error: FaceErrors;
}) {
  const id = useId();
  const [text, setText] = useState(() => facesToText(faces));
  // Follow the form when it changes from outside (reset, reload, switching entry), never while the text already says the same:
  // React's "adjust state when a prop changes" pattern, during render rather than in an effect.
  const [seenFaces, setSeenFaces] = useState(faces);
  if (seenFaces !== faces) {
    setSeenFaces(faces);
    if (!sameFaces(facesFromText(text).faces, faces)) setText(facesToText(faces));
  }
  const tokens = entry === "list" ? facesFromText(text).tokens : undefined;
  const messages = faceErrorMessages(error, faces, tokens);
  const errorId = messages.length > 0 ? `${id}-error` : undefined;
  const hintId = `${id}-hint`;

  return (
    <div className="flex min-w-0 flex-col gap-1">
      {entry === "list" ? (
        <>
          <label htmlFor={id} className="font-bold">
            Faces of {dieLabel}
          </label>
          <p id={hintId} className="text-sm text-ink-soft">
            Whole numbers separated by commas or spaces, e.g. 1, 3, 3, 4, 4, 9.
          </p>
          <input
            id={id}
            type="text"
            inputMode="text"
            autoComplete="off"
            spellCheck={false}
            value={text}
            onChange={(event) => {
              setText(event.target.value);
              onChange(facesFromText(event.target.value).faces);
            }}
            onBlur={onBlur}
            aria-invalid={messages.length > 0 || undefined}
            aria-describedby={[hintId, errorId].filter(Boolean).join(" ")}
            className={`min-h-11 w-full rounded-lg border-2 bg-white px-3 py-2 font-mono text-base text-ink ${messages.length > 0 ? "border-alarm" : "border-line focus:border-tide"}`}
          />
        </>
      ) : (
        <fieldset aria-describedby={errorId}>
          <legend className="font-bold">Faces of {dieLabel}</legend>
          <ul className="mt-1 flex flex-wrap gap-2">
            {faces.map((face, index) => (
              <li key={index} className="flex items-end gap-0.5">
                <FaceBox
                  label={`Face ${index + 1}`}
                  value={face}
                  invalid={Boolean(error?.[index]?.message)}
                  onBlur={onBlur}
                  onChange={(value) => onChange(faces.map((each, position) => (position === index ? value : each)))}
                />
                <button
                  type="button"
                  className="mb-0.5 min-h-11 min-w-8 rounded-lg px-1 text-lg font-bold text-ink-soft hover:bg-alarm-light hover:text-alarm"
                  aria-label={`Remove face ${index + 1} of ${dieLabel}`}
                  onClick={() => onChange(faces.filter((_, position) => position !== index))}
                >
                  ×
                </button>
              </li>
            ))}
            <li className="flex items-end">
              <button
                type="button"
                disabled={faces.length >= FACES_MAX}
                className="min-h-11 rounded-lg border-2 border-dashed border-ink/40 px-3 font-bold hover:border-tide disabled:opacity-50"
                onClick={() =>
                  onChange([...faces, faces.length > 0 && !Number.isNaN(faces[faces.length - 1]) ? faces[faces.length - 1] : 1])
                }
              >
                + Add a face<span className="sr-only"> to {dieLabel}</span>
              </button>
            </li>
          </ul>
        </fieldset>
      )}
      {messages.length > 0 && (
        <ul id={errorId} className="text-sm font-bold text-alarm" data-testid="face-errors">
          {messages.slice(0, 6).map((message) => (
            <li key={message}>{message}</li>
          ))}
          {messages.length > 6 && <li>and {messages.length - 6} more problems.</li>}
        </ul>
      )}
    </div>
  );
}

function FaceBox({
  label,
  value,
  invalid,
  onChange,
  onBlur,
}: {
  label: string;
  value: number;
  invalid: boolean;
  onChange: (value: number) => void;
  onBlur: () => void;
}) {
  const id = useId();
  const [text, setText] = useState(Number.isNaN(value) ? "" : String(value));
  const [seenValue, setSeenValue] = useState(value);
  if (!Object.is(seenValue, value)) {
    setSeenValue(value);
    const typed = text.trim() === "" ? Number.NaN : Number(text);
    if (!Object.is(typed, value)) setText(Number.isNaN(value) ? "" : String(value));
  }
  return (
    <div className="flex flex-col">
      <label htmlFor={id} className="text-xs font-bold text-ink-soft">
        {label}
      </label>
      <input
        id={id}
        type="text"
        inputMode="numeric"
        autoComplete="off"
        value={text}
        aria-invalid={invalid || undefined}
        onBlur={onBlur}
        onChange={(event) => {
          setText(event.target.value);
          const trimmed = event.target.value.trim();
          onChange(/^[+-]?\d+(\.\d+)?$/.test(trimmed) ? Number(trimmed) : Number.NaN);
        }}
        className={`min-h-11 w-14 rounded-lg border-2 bg-white px-2 py-1 text-center font-mono text-base ${invalid ? "border-alarm" : "border-line focus:border-tide"}`}
      />
    </div>
  );
}
