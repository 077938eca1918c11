import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PositionPreview } from "@/components/layouts/position-preview";
import { PositionsTable } from "@/components/layouts/positions-table";
import { LayoutQuerySchema } from "@/lib/schemas/layouts";
import { findLayout, getLayout } from "@/server/layouts";
import { requireUserFor } from "@/server/page-guard";

export const metadata: Metadata = { title: "Layout" };

export default async function LayoutPage({
  params,
  searchParams,
}: {
  params: Promise<{ typeCode: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { typeCode } = await params;
  await requireUserFor("layouts", `/layouts/${typeCode}`);
  const raw = await searchParams;
  const parsed = LayoutQuerySchema.safeParse({ zone: raw.zone || undefined, ata: raw.ata || undefined });
  const query = parsed.success ? parsed.data : {};
  const filtered = Boolean(query.zone || query.ata);
  const layout = await findLayout(typeCode, query);
  if (!layout) notFound();
  const everything = filtered ? await getLayout(typeCode) : layout;

  return (
    <div className="space-y-4">
      <p>
        <Link href="/layouts" className="underline">
          ← Layouts
        </Link>
      </p>
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">
            <span className="num">{layout.type.code}</span> {layout.type.name}
          </h1>
          <p>
            <span className="num">{layout.total}</span> positions in <span className="num">{layout.zones.length}</span> zones.
          </p>
        </div>
        <Link href={`/layouts/${encodeURIComponent(layout.type.code)}/new-position`} className="btn btn-primary">
          New position
        </Link>
      </div>

      <form method="get" className="panel flex flex-wrap items-end gap-3 p-3" aria-label="Filter positions">
        <div>
          <label htmlFor="zone" className="field-label">
            Zone
          </label>
          <select id="zone" name="zone" defaultValue={query.zone ?? ""} className="field-input">
            <option value="">All zones ({layout.total})</option>
            {layout.zones.map(({ zone, count }) => (
              <option key={zone} value={zone}>
                {zone || "(no zone)"} ({count})
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="ata" className="field-label">
            ATA chapter
          </label>
          <select id="ata" name="ata" defaultValue={query.ata ?? ""} className="field-input">
            <option value="">All chapters ({layout.total})</option>
            {query.ata && query.ata.length > 2 ? <option value={query.ata}>{query.ata}</option> : null}
            {layout.chapters.map(({ chapter, count }) => (
              <option key={chapter} value={chapter}>
                {chapter} ({count})
              </option>
            ))}
          </select>
        </div>
        <button type="submit" className="btn btn-primary">
          Show
        </button>
        {filtered ? (
          <Link href={`/layouts/${encodeURIComponent(layout.type.code)}`} className="btn btn-secondary">
            Clear
          </Link>
        ) : null}
      </form>

      <p aria-live="polite">
        Showing <span className="num">{layout.positions.length}</span> of <span className="num">{layout.total}</span> positions.
      </p>
      <div className="grid gap-4 xl:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        {layout.positions.length ? <PositionsTable typeCode={layout.type.code} positions={layout.positions} /> : <p>No positions match these filters.</p>}
        <PositionPreview
          title={`${layout.type.code}: ${layout.positions.length} shown positions highlighted among ${layout.total}`}
          points={everything.positions}
          highlighted={filtered ? new Set(layout.positions.map((p) => p.code)) : undefined}
        />
      </div>
    </div>
  );
}
