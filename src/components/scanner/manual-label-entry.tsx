"use client";

// Typed entry: a keyboard-wedge scanner types the label's text here (and presses Enter), or a person
// types what the label says. Always offered, because cameras fail and labels get scuffed.
import { useId, useState, type FormEvent } from "react";

export function ManualLabelEntry({
  onSubmit,
  example = "P/N 1234-56 S/N AB123",
  what = "the part and serial as printed",
}: {
  onSubmit: (text: string) => void;
  /** What a typed label looks like, shown in the hint. */
  example?: string;
  /** What to type besides a wedge scanner's text. */
  what?: string;
}) {
  const id = useId();
  const [text, setText] = useState("");
  const [error, setError] = useState<string | null>(null);
  const inputId = `${id}-text`;
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (text.trim() === "") {
      setError("Type the label's text first, or scan it with a wedge scanner into this field.");
      return;
    }
    setError(null);
    onSubmit(text);
  };

  return (
    <form onSubmit={submit} noValidate className="space-y-2">
      <label htmlFor={inputId} className="field-label text-lg">
        Type or wedge-scan the label
      </label>
      <p id={hintId} className="text-[var(--ink-soft)]">
        The whole text from a wedge scanner, or {what}, for example <span className="num">{example}</span>.
      </p>
      <div className="flex flex-wrap gap-3">
        <input
          id={inputId}
          name="label-text"
          type="text"
          autoComplete="off"
          autoCapitalize="characters"
          spellCheck={false}
          className="field-input num min-h-glove min-w-0 flex-[1_1_14rem] text-lg"
          value={text}
          onChange={(event) => setText(event.target.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${hintId} ${errorId}` : hintId}
        />
        <button type="submit" className="btn btn-secondary min-h-glove flex-[1_1_8rem] text-lg">
          Read this text
        </button>
      </div>
      {error ? (
        <p id={errorId} className="field-error">
          {error}
        </p>
      ) : null}
    </form>
  );
}
