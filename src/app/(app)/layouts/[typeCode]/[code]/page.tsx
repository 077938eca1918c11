import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { FormMessage } from "@/components/catalog/form-field";
import { CautionList } from "@/components/layouts/caution-list";
import { PositionForm } from "@/components/layouts/position-form";
import { findLayout } from "@/server/layouts";
import { requireUserFor } from "@/server/page-guard";
import { updatePositionAction } from "../../actions";

export const metadata: Metadata = { title: "Position" };

export default async function PositionPage({
  params,
  searchParams,
}: {
  params: Promise<{ typeCode: string; code: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { typeCode, code } = await params;
  await requireUserFor("layouts", `/layouts/${typeCode}/${code}`);
  const { created } = await searchParams;
  const layout = await findLayout(typeCode);
  if (!layout) notFound();
  const position = layout.positions.find((p) => p.code === code.toUpperCase());
  if (!position) notFound();
  const type = layout.type.code;

  return (
    <div className="space-y-4">
      <p>
        <Link href={`/layouts/${encodeURIComponent(type)}`} className="underline">
          ← {type} layout
        </Link>
      </p>
      <div>
        <h1 className="text-2xl font-bold">
          <span className="num">{position.code}</span> {position.label}
        </h1>
        <p>
          <span className="num">{type}</span> · ATA <span className="num">{position.ataChapter}</span>
          {position.zone ? <> · zone {position.zone}</> : null}
          {position.parentCode ? (
            <>
              {" "}· under{" "}
              <Link href={`/layouts/${encodeURIComponent(type)}/${encodeURIComponent(position.parentCode)}`} className="num underline">
                {position.parentCode}
              </Link>
            </>
          ) : null}
        </p>
      </div>
      {created ? (
        <FormMessage ok message="Position added." />
      ) : null}
      <CautionList cautions={position.cautions} independentInspection={position.requiresIndependentInspection} />
      <div className="panel p-4">
        <PositionForm
          action={updatePositionAction.bind(null, type, position.code)}
          typeCode={type}
          current={position}
          others={layout.positions.filter((p) => p.code !== position.code).map((p) => ({ code: p.code, label: p.label, x: p.x, y: p.y }))}
          zones={layout.zones.map((z) => z.zone).filter(Boolean)}
          submitLabel="Save position"
        />
      </div>
    </div>
  );
}
