import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { encodePositionLabel, POSITION_LABEL_TAG } from "@/domain/labels";
import { LabelLayoutSelect, LabelPageStyle, LabelSheets, type LabelLayout } from "@/components/labels/label-sheets";
import { PositionLabel, type PositionLabelContent } from "@/components/labels/position-label";
import { PrintButton } from "@/components/labels/print-button";
import { registrationParam } from "@/lib/schemas/common";
import { getAircraftOrThrow } from "@/server/aircraft";
import { AppError } from "@/server/errors";
import { renderLabelSvg } from "@/server/label-symbols";
import { getLayout } from "@/server/layouts";
import { requireUserFor } from "@/server/page-guard";

type Props = { params: Promise<{ registration: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { registration } = await params;
  return { title: `Position labels ${registration.toUpperCase()}` };
}

const PositionLabelsQuery = z.object({
  layout: z.enum(["label", "a4", "letter"]).catch("a4"),
  zone: z.string().trim().max(16).catch("").default(""),
  position: z.string().trim().toUpperCase().max(32).catch("").default(""),
});

// Bars narrower than about 0.19 mm want a 300 dpi printer and a good scanner [from memory: common
// Code 128 printing practice, not a value from a standard]. Set B needs 11 modules a character plus
// start, check and stop (35), and we leave 10 modules of quiet zone, across 94 mm.
const CODE128_WIDTH_MM = 94;
const code128ModuleMm = (text: string) => CODE128_WIDTH_MM / (11 * text.length + 35 + 10);
const DENSE_MODULE_MM = 0.19;

export default async function PositionLabelsPage({ params, searchParams }: Props) {
  const { registration: raw } = await params;
  await requireUserFor("fleet", `/aircraft/${raw}/position-labels`);
  const registration = registrationParam.safeParse(raw);
  if (!registration.success) notFound();
  const query = PositionLabelsQuery.parse(await searchParams);
  const layout: LabelLayout = query.layout;

  const aircraft = await getAircraftOrThrow(registration.data).catch((error) => {
    if (error instanceof AppError && error.kind === "not_found") notFound();
    throw error;
  });
  const whole = await getLayout(aircraft.type);
  const zones = whole.zones.filter((z) => z.zone !== "");
  const zone = zones.some((z) => z.zone === query.zone) ? query.zone : "";
  const positions = whole.positions.filter((p) => (query.position ? p.code === query.position : !zone || p.zone === zone));
  const unknownPosition = query.position !== "" && positions.length === 0;

  const labels: PositionLabelContent[] = positions.map((p) => {
    const text = encodePositionLabel({ registration: aircraft.registration, positionCode: p.code });
    return {
      registration: aircraft.registration,
      aircraftType: aircraft.type,
      positionCode: p.code,
      name: p.label,
      ataChapter: p.ataChapter,
      zone: p.zone,
      text,
      dataMatrixSvg: renderLabelSvg("datamatrix", text),
    };
  });
  const dense = labels.filter((l) => code128ModuleMm(l.text) < DENSE_MODULE_MM).map((l) => l.positionCode);
  const airframeHref = `/aircraft/${encodeURIComponent(aircraft.registration)}`;
  const what = query.position ? `position ${query.position}` : zone ? `zone ${zone}` : "every position";

  return (
    <div className="space-y-4">
      <LabelPageStyle layout={layout} />
      <div className="no-print space-y-3">
        <p>
          <Link href={query.position ? `${airframeHref}?position=${encodeURIComponent(query.position)}` : airframeHref} className="underline">
            ← {aircraft.registration}
          </Link>
        </p>
        <h1 className="text-2xl font-bold">
          Position labels for <span className="num">{aircraft.registration}</span>
        </h1>
        <p className="max-w-prose">
          Each label names one position of this aircraft ({aircraft.typeName}, <span className="num">{aircraft.type}</span>). In the swap,
          scanning it chooses the position. The codes carry Threadline&apos;s own position label text, <span className="num">{POSITION_LABEL_TAG}</span>{" "}
          followed by the registration and the position code, printed under the symbols too so it can be typed.
        </p>
        <p className="max-w-prose rounded-md border-2 border-[var(--ink-soft)] p-3">
          Fix a label at its position only where and with the materials your maintenance manual and local rules allow, or keep the sheet with the
          aircraft&apos;s documents. Never stick it on the unit itself: the label must stay with the aircraft when the unit comes off.
        </p>
        <form method="get" className="flex flex-wrap items-end gap-3">
          {query.position ? <input type="hidden" name="position" value={query.position} /> : (
            <div>
              <label htmlFor="label-zone" className="field-label">
                Positions
              </label>
              <select id="label-zone" name="zone" defaultValue={zone} className="field-input">
                <option value="">Every position ({whole.total})</option>
                {zones.map((z) => (
                  <option key={z.zone} value={z.zone}>
                    Zone {z.zone} ({z.count})
                  </option>
                ))}
              </select>
            </div>
          )}
          <LabelLayoutSelect id="label-layout" layout={layout} />
          <button type="submit" className="btn btn-secondary min-h-glove">
            Show
          </button>
          {labels.length > 0 ? <PrintButton>Print {labels.length === 1 ? "the label" : `${labels.length} labels`}</PrintButton> : null}
        </form>
        {query.position ? (
          <p>
            <Link href={`${airframeHref}/position-labels?layout=${layout}`} className="underline">
              Labels for every position of {aircraft.registration}
            </Link>
          </p>
        ) : null}
        <p role="status" data-testid="position-label-count">
          {unknownPosition
            ? `${aircraft.registration} has no position ${query.position}: check the code on the airframe page.`
            : `${labels.length} ${labels.length === 1 ? "label" : "labels"}, ${what}.`}
        </p>
        {dense.length > 0 ? (
          <p className="max-w-prose rounded-md border-2 border-[var(--ink-soft)] p-3">
            The Code 128 of {dense.length === 1 ? "position" : "positions"} <span className="num">{dense.join(", ")}</span> has narrow bars: print at
            300 dpi or more, or scan the Data Matrix.
          </p>
        ) : null}
      </div>
      <LabelSheets layout={layout} labels={labels.map((content) => <PositionLabel key={content.positionCode} content={content} />)} />
    </div>
  );
}
