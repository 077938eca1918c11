import Link from "next/link";
import { SafetyNote } from "@/components/safety/safety-note";
import { PositionStateBadge } from "@/components/status/position-state";
import { formatCycles, formatInstant } from "@/lib/format";
import type { MapPosition } from "@/lib/position-types";

export function PositionDetail({
  position,
  timeZone,
  swapHref,
  labelHref,
}: {
  position: MapPosition;
  timeZone: string;
  swapHref: string | null;
  /** The print page of this position's label. */
  labelHref?: string;
}) {
  const fitted = position.fitted;
  return (
    <section aria-labelledby="position-heading" className="panel space-y-3 p-4" data-testid="position-detail">
      <div>
        <p className="num text-sm font-semibold text-[var(--ink-soft)]">ATA {position.ataChapter} · {position.zone}</p>
        <h2 id="position-heading" className="text-xl font-bold">
          <span className="num">{position.code}</span> — {position.label}
        </h2>
        <div className="mt-1 flex flex-wrap gap-2">
          <PositionStateBadge state={position.state} />
          {position.independentInspection ? (
            <span className="inline-flex items-center gap-1 rounded border-2 border-[var(--ink-soft)] px-2 py-0.5 text-sm font-semibold">
              <span aria-hidden="true">⧉</span> Independent inspection required
            </span>
          ) : null}
        </div>
      </div>
      {fitted ? (
        <dl className="grid grid-cols-2 gap-x-4 gap-y-2">
          <div>
            <dt className="text-sm font-semibold">P/N</dt>
            <dd className="num">{fitted.partNumber}</dd>
          </div>
          <div>
            <dt className="text-sm font-semibold">S/N</dt>
            <dd className="num">{fitted.serialNumber}</dd>
          </div>
          <div className="col-span-2">
            <dt className="text-sm font-semibold">Description</dt>
            <dd>{fitted.description} <span className="num">(CAGE {fitted.cage})</span></dd>
          </div>
          <div>
            <dt className="text-sm font-semibold">Installed</dt>
            <dd>{formatInstant(fitted.installedAt, timeZone)}</dd>
          </div>
          <div>
            <dt className="text-sm font-semibold">On wing</dt>
            <dd className="num">
              {fitted.hoursOnWing} h · {formatCycles(fitted.cyclesOnWing)} cyc
            </dd>
          </div>
          <div>
            <dt className="text-sm font-semibold">TSN / CSN</dt>
            <dd className="num">
              {fitted.tsn} · {formatCycles(fitted.csn)}
            </dd>
          </div>
          <div>
            <dt className="text-sm font-semibold">TSO / CSO</dt>
            <dd className="num">
              {fitted.tso ?? "—"} · {fitted.cso === null ? "—" : formatCycles(fitted.cso)}
            </dd>
          </div>
          <div className="col-span-2">
            <dt className="text-sm font-semibold">Remaining life</dt>
            <dd className="num">
              {[
                fitted.life.hoursRemaining !== null ? `${fitted.life.hoursRemaining} h` : null,
                fitted.life.cyclesRemaining !== null ? `${formatCycles(fitted.life.cyclesRemaining)} cycles` : null,
                fitted.life.daysRemaining !== null ? `${formatCycles(fitted.life.daysRemaining)} days` : null,
              ]
                .filter(Boolean)
                .join(" · ") || "No life limit on this part number"}
            </dd>
          </div>
        </dl>
      ) : (
        <p>Nothing is fitted at this position.</p>
      )}
      <p className="text-sm">
        <span className="font-semibold">Eligible P/N:</span> <span className="num">{position.eligible.join(", ") || "none set"}</span>
      </p>
      {position.cautions.length ? <SafetyNote cautions={position.cautions} /> : null}
      <div className="flex flex-wrap gap-2">
        {fitted ? (
          <Link href={`/parts/${fitted.partId}`} className="btn btn-secondary">
            Open part page
          </Link>
        ) : null}
        {swapHref ? (
          <Link href={swapHref} className="btn btn-primary">
            Record a swap here
          </Link>
        ) : null}
        {labelHref ? (
          <Link href={labelHref} className="btn btn-secondary">
            Print its position label
          </Link>
        ) : null}
      </div>
    </section>
  );
}
