import type { TraceFinding } from "@/server/trace";
import { FINDING_STYLE } from "./finding-style";

interface Props {
  findings: TraceFinding[];
  /** Where a seq links to (an anchor in the thread), or null to name the seq without a link. */
  hrefFor?: ((seq: number) => string) | null;
  headingLevel?: "h2" | "h3";
  title?: string;
}

function SeqRef({ seq, hrefFor }: { seq: number; hrefFor?: ((seq: number) => string) | null }) {
  return hrefFor ? (
    <a className="num font-semibold text-[var(--accent)] underline" href={hrefFor(seq)}>
      seq {seq}
    </a>
  ) : (
    <span className="num font-semibold">seq {seq}</span>
  );
}

/** The continuity findings of one thread, each naming the entries it rests on. */
export function FindingsList({ findings, hrefFor, headingLevel = "h2", title = "Findings" }: Props) {
  const Heading = headingLevel;
  return (
    <section aria-labelledby="findings-heading" className="findings panel p-4">
      <Heading id="findings-heading" className="mb-2 text-lg font-semibold">
        {title} <span className="num text-sm font-normal">({findings.length})</span>
      </Heading>
      {findings.length === 0 ? (
        <p className="flex items-center gap-2">
          <span aria-hidden="true">✓</span> No findings: the thread is continuous, with certificates, eligible positions and times that follow.
        </p>
      ) : (
        <ol className="space-y-2">
          {findings.map((finding, index) => {
            const style = FINDING_STYLE[finding.kind];
            return (
              <li key={`${finding.seq}-${finding.kind}`} id={`finding-${index + 1}`} className="finding rounded border-2 border-purple-800 p-2 dark:border-purple-300">
                <p className="flex flex-wrap items-center gap-x-3 gap-y-1 font-semibold">
                  <span className="inline-flex items-center gap-1 text-purple-900 dark:text-purple-100">
                    <span aria-hidden="true">{style.glyph}</span> {style.word}
                  </span>
                  <span>
                    at <SeqRef seq={finding.seq} hrefFor={hrefFor} />
                    {finding.relatedSeqs.length ? (
                      <>
                        {" "}
                        (also{" "}
                        {finding.relatedSeqs.map((seq, i) => (
                          <span key={seq}>
                            {i > 0 ? ", " : ""}
                            <SeqRef seq={seq} hrefFor={hrefFor} />
                          </span>
                        ))}
                        )
                      </>
                    ) : null}
                  </span>
                </p>
                <p>{finding.message}</p>
              </li>
            );
          })}
        </ol>
      )}
    </section>
  );
}
