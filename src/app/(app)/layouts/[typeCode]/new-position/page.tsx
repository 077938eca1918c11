import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PositionForm } from "@/components/layouts/position-form";
import { findLayout } from "@/server/layouts";
import { requireUserFor } from "@/server/page-guard";
import { createPositionAction } from "../../actions";

export const metadata: Metadata = { title: "New position" };

export default async function NewPositionPage({ params }: { params: Promise<{ typeCode: string }> }) {
  const { typeCode } = await params;
  await requireUserFor("layouts", `/layouts/${typeCode}/new-position`);
  const layout = await findLayout(typeCode);
  if (!layout) notFound();
  const code = layout.type.code;
  return (
    <div className="space-y-4">
      <p>
        <Link href={`/layouts/${encodeURIComponent(code)}`} className="underline">
          ← {code} layout
        </Link>
      </p>
      <h1 className="text-2xl font-bold">
        New position on <span className="num">{code}</span>
      </h1>
      <div className="panel p-4">
        <PositionForm
          action={createPositionAction.bind(null, code)}
          typeCode={code}
          others={layout.positions.map((p) => ({ code: p.code, label: p.label, x: p.x, y: p.y }))}
          zones={layout.zones.map((z) => z.zone).filter(Boolean)}
          submitLabel="Add position"
        />
      </div>
    </div>
  );
}
