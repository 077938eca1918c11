import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CautionList } from "@/components/layouts/caution-list";
import { PositionForm } from "@/components/layouts/position-form";
import { AppError } from "@/server/errors";
import { getLayout } from "@/server/layouts";
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
  const layout = await getLayout(typeCode).catch((error) => {
    if (error instanceof AppError && error.kind === "not_found") notFound();
    throw error;
  });
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
        <p role="status" className="rounded-md border-2 border-green-800 bg-green-50 p-3 font-semibold text-green-900 dark:bg-green-950 dark:text-green-100">
          <span aria-hidden="true">✔ </span>Position added.
        </p>
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
