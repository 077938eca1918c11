"use client";

// Shows what a scan gave: the part number, serial and CAGE read from a part label, or the aircraft
// and position read from a position label, to accept or scan again; or the refusal (what was
// found, what is missing or wrong) with the way forward.
import { useEffect, useRef } from "react";
import { showControlCharacters } from "@/domain/labels";
import { isPartReading, isPositionReading, PART_LABEL_TARGET, SYMBOLOGY_NAMES, SYNTAX_NAMES, typingExample, type LabelScan, type ScanTarget } from "./label-scan";

const SOURCE_NAMES = { camera: "camera", photo: "photo", typed: "typed text" } as const;

function whereFrom(scan: LabelScan): string {
  const symbology = scan.symbology ? (SYMBOLOGY_NAMES[scan.symbology] ?? scan.symbology) : null;
  return symbology ? `${symbology}, read from the ${SOURCE_NAMES[scan.source]}` : `From the ${SOURCE_NAMES[scan.source]}`;
}

function Field({ term, value, testId, code = true }: { term: string; value: string | null; testId: string; code?: boolean }) {
  return (
    <div className="grid grid-cols-[6rem_1fr] items-baseline gap-2 py-1">
      <dt className="font-semibold">{term}</dt>
      <dd data-testid={testId} className={!value ? "italic" : code ? "num break-all text-xl font-bold" : ""}>
        {value ?? "not on the label"}
      </dd>
    </div>
  );
}

export function ScanReading({
  scan,
  target = PART_LABEL_TARGET,
  onAccept,
  onRescan,
}: {
  scan: LabelScan;
  target?: ScanTarget;
  onAccept: () => void;
  onRescan: () => void;
}) {
  const headingRef = useRef<HTMLHeadingElement>(null);
  // Focus moves to the outcome so a screen reader announces it and Enter/Space reach its buttons.
  useEffect(() => headingRef.current?.focus(), [scan]);
  const { parsed } = scan;
  const again = scan.source === "typed" ? "Change the text" : "Scan again";
  const position = isPositionReading(parsed) ? parsed : null;
  const positionName =
    position && target.kind === "position" ? (target.positions.find((p) => p.code === position.positionCode)?.label ?? null) : null;

  return (
    <section
      aria-labelledby="scan-reading-heading"
      data-testid="scan-reading"
      className={`rounded-md border-4 p-4 ${parsed.ok ? "border-[var(--accent)]" : "border-red-700 dark:border-red-400"} bg-[var(--panel)]`}
    >
      <h3 id="scan-reading-heading" ref={headingRef} tabIndex={-1} className="text-xl font-bold">
        {position ? (
          <>
            <span aria-hidden="true">✓ </span>Position label read: check it is the position in front of you
          </>
        ) : parsed.ok ? (
          <>
            <span aria-hidden="true">✓ </span>Label read: check it against the part
          </>
        ) : (
          <>
            <span aria-hidden="true">✗ </span>This label cannot be used
          </>
        )}
      </h3>
      <p className="mt-1 text-[var(--ink-soft)]">{whereFrom(scan)}</p>

      {isPositionReading(parsed) ? (
        <dl className="mt-3 divide-y divide-[var(--rule)]">
          <Field term="Aircraft" value={parsed.registration} testId="reading-registration" />
          <Field term="Position" value={parsed.positionCode} testId="reading-position-code" />
          <Field term="Name" value={positionName} testId="reading-position-name" code={false} />
          <Field term="Syntax" value={`${SYNTAX_NAMES[parsed.syntax]}, version ${parsed.version}`} testId="reading-syntax" code={false} />
        </dl>
      ) : isPartReading(parsed) ? (
        <>
          <dl className="mt-3 divide-y divide-[var(--rule)]">
            <Field term="P/N" value={parsed.partNumber} testId="reading-part-number" />
            <Field term="S/N" value={parsed.serialNumber} testId="reading-serial-number" />
            <Field term="CAGE" value={parsed.cage} testId="reading-cage" />
            <Field
              term="Syntax"
              value={`${SYNTAX_NAMES[parsed.syntax] ?? parsed.syntax}${parsed.format ? `, format ${parsed.format}` : ""}`}
              testId="reading-syntax"
              code={false}
            />
          </dl>
          {parsed.inferredSeparators ? (
            <p className="mt-3 rounded-md border-2 border-amber-700 p-3 font-semibold dark:border-amber-400">
              <span aria-hidden="true">⚠ </span>The scanner sent no separators between the fields, so Threadline worked
              out where each one ends. Compare P/N and S/N with the printed label before you use them.
            </p>
          ) : null}
        </>
      ) : (
        <div role="alert" className="mt-3 space-y-2">
          <p className="font-semibold">{parsed.message}</p>
          {parsed.found.length > 0 ? (
            <>
              <p>What the label does carry:</p>
              <ul className="list-disc pl-6">
                {parsed.found.map((element) => (
                  <li key={`${element.id}-${element.value}`}>
                    {element.name} <span className="num font-semibold">{element.value}</span> ({element.id})
                  </li>
                ))}
              </ul>
            </>
          ) : null}
          {target.kind === "position" ? (
            <p>
              Scan the position&apos;s own label again, or type the text printed under its codes, like{" "}
              <span className="num">{typingExample(target)}</span>.
            </p>
          ) : (
            <p>
              Scan the label again, or type the part number and serial number as printed, for example{" "}
              <span className="num">{typingExample(target)}</span>.
            </p>
          )}
        </div>
      )}

      <details className="mt-3">
        <summary className="min-h-glove cursor-pointer py-2 font-semibold">Exact text received</summary>
        <p className="num break-all rounded bg-[var(--page)] p-2">{showControlCharacters(scan.raw)}</p>
      </details>

      <div className="mt-4 flex flex-wrap gap-3">
        {parsed.ok ? (
          <button type="button" className="btn btn-primary min-h-glove flex-1 text-lg" onClick={onAccept}>
            {position ? "Use this position" : "Use this label"}
          </button>
        ) : null}
        <button
          type="button"
          className={`btn min-h-glove flex-1 text-lg ${parsed.ok ? "btn-secondary" : "btn-primary"}`}
          onClick={onRescan}
        >
          {again}
        </button>
      </div>
    </section>
  );
}
