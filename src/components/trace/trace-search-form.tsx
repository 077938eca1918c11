interface Props {
  values: { serial?: string; partNumber?: string; cage?: string };
  errors?: Record<string, string>;
}

/** A plain GET form: the search lands in the address, so a trace can be bookmarked and shared. */
export function TraceSearchForm({ values, errors = {} }: Props) {
  const field = (name: "serial" | "partNumber" | "cage", label: string, hint: string, size: string) => (
    <div className={size}>
      <label htmlFor={`trace-${name}`} className="field-label">
        {label}
      </label>
      <input
        id={`trace-${name}`}
        name={name}
        defaultValue={values[name] ?? ""}
        className="field-input num"
        autoComplete="off"
        spellCheck={false}
        aria-invalid={errors[name] ? true : undefined}
        aria-describedby={errors[name] ? `trace-${name}-error` : `trace-${name}-hint`}
        required={name === "serial"}
      />
      {errors[name] ? (
        <p id={`trace-${name}-error`} className="field-error">
          {errors[name]}
        </p>
      ) : (
        <p id={`trace-${name}-hint`} className="mt-1 text-sm">
          {hint}
        </p>
      )}
    </div>
  );
  return (
    <form method="get" action="/trace" className="panel flex flex-wrap items-start gap-3 p-4" role="search" aria-label="Trace a serial">
      {field("serial", "Serial number", "Exactly as marked on the unit.", "w-full sm:w-64")}
      {field("partNumber", "Part number (optional)", "Narrows the search when serials repeat.", "w-full sm:w-56")}
      {field("cage", "CAGE (optional)", "Five characters.", "w-full sm:w-44")}
      <div className="w-full sm:w-auto sm:pt-7">
        <button type="submit" className="btn btn-primary w-full sm:w-auto">
          Trace
        </button>
      </div>
    </form>
  );
}
