import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { encodeAtaTextElements, encodeIso15434Format06ForCode128 } from "@/domain/labels";
import { LabelLayoutSelect, LabelPageStyle, LabelSheets, type LabelLayout } from "@/components/labels/label-sheets";
import { PartLabel, type PartLabelContent } from "@/components/labels/part-label";
import { PrintButton } from "@/components/labels/print-button";
import { StatusBadge } from "@/components/stock/status-badge";
import { AppError } from "@/server/errors";
import { labelMessage, renderLabelSvg } from "@/server/label-symbols";
import { requireUserFor } from "@/server/page-guard";
import { getPartLabel } from "@/server/stock";

export const metadata: Metadata = { title: "Part label" };

const LabelQuery = z.object({
  layout: z.enum(["label", "a4", "letter"]).catch("label"),
  copies: z.coerce.number().int().min(1).max(50).catch(1),
});

export default async function PartLabelPage({ params, searchParams }: { params: Promise<{ partId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { partId } = await params;
  await requireUserFor("parts", `/parts/${partId}/label`);
  const id = Number(partId);
  if (!Number.isSafeInteger(id) || id <= 0) notFound();
  const query = LabelQuery.parse(await searchParams);
  const layout: LabelLayout = query.layout;
  const copies = layout === "label" ? query.copies : Math.max(query.copies, 1);

  const part = await getPartLabel(id).catch((error) => {
    if (error instanceof AppError && error.kind === "not_found") notFound();
    throw error;
  });
  const message = labelMessage(part);
  let ataLine: string | null = null;
  try {
    ataLine = encodeAtaTextElements(part);
  } catch {
    ataLine = null; // a value with spaces cannot be written as text elements; the other lines still carry it
  }
  const content: PartLabelContent = { ...part, ataLine, message, dataMatrixSvg: renderLabelSvg("datamatrix", message) };
  const code128Safe = encodeIso15434Format06ForCode128(part).readableWithoutSeparators;

  return (
    <div className="space-y-4">
      <LabelPageStyle layout={layout} />
      <div className="no-print space-y-3">
        <p>
          <Link href={`/parts/${part.id}`} className="underline">
            ← Part page
          </Link>
        </p>
        <h1 className="text-2xl font-bold">
          Label for P/N <span className="num">{part.partNumber}</span> S/N <span className="num">{part.serialNumber}</span>
        </h1>
        <p className="flex flex-wrap items-center gap-2">
          <StatusBadge status={part.status} /> {part.bin ? <span>Bin <span className="num">{part.bin}</span></span> : null}
        </p>
        <form method="get" className="flex flex-wrap items-end gap-3">
          <LabelLayoutSelect id="label-layout" layout={layout} />
          <div>
            <label htmlFor="label-copies" className="field-label">
              Copies
            </label>
            <input id="label-copies" name="copies" type="number" min={1} max={50} defaultValue={copies} className="field-input num w-28" />
          </div>
          <button type="submit" className="btn btn-secondary">
            Show
          </button>
          <PrintButton>Print {copies === 1 ? "the label" : `${copies} labels`}</PrintButton>
        </form>
        {!code128Safe ? (
          <p className="max-w-prose rounded-md border-2 border-[var(--ink-soft)] p-3">
            This serial number reads two ways on a Code 128 reader that drops separators. Scan the Data Matrix on this label where you can.
          </p>
        ) : null}
      </div>
      <LabelSheets layout={layout} labels={Array.from({ length: copies }, (_, i) => <PartLabel key={i} content={content} />)} />
    </div>
  );
}
