import type { Metadata } from "next";
import Link from "next/link";
import { CatalogTable, type SortKey } from "@/components/catalog/catalog-table";
import { PartNumberListQuerySchema } from "@/lib/schemas/catalog";
import { countPartNumbersByChapter, listPartNumbers } from "@/server/catalog";
import { requireUserFor } from "@/server/page-guard";

export const metadata: Metadata = { title: "Catalog" };

const PAGE_SIZE = 50;

export default async function CatalogPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requireUserFor("catalog", "/catalog");
  const raw = await searchParams;
  const one = (name: string) => (typeof raw[name] === "string" ? (raw[name] as string) : undefined);
  const parsed = PartNumberListQuerySchema.safeParse({ q: one("q"), ata: one("ata"), sort: one("sort"), dir: one("dir") });
  const query = parsed.success ? parsed.data : {};
  const page = Math.max(1, Number.parseInt(one("page") ?? "1", 10) || 1);
  const sort: SortKey = query.sort ?? "ataChapter";
  const dir = query.dir ?? "asc";

  const [{ partNumbers, total }, chapters] = await Promise.all([
    listPartNumbers({ ...query, sort, dir, limit: PAGE_SIZE, offset: (page - 1) * PAGE_SIZE }),
    countPartNumbersByChapter(),
  ]);
  const catalogSize = chapters.reduce((sum, chapter) => sum + chapter.count, 0);
  const href = (changes: Record<string, string | number | undefined>) => {
    const params = new URLSearchParams();
    const merged = { q: query.q, ata: query.ata, sort, dir, page, ...changes };
    for (const [key, value] of Object.entries(merged)) if (value !== undefined && value !== "" && !(key === "page" && value === 1)) params.set(key, String(value));
    return `/catalog${params.size ? `?${params}` : ""}`;
  };
  const first = total === 0 ? 0 : (page - 1) * PAGE_SIZE + 1;
  const last = Math.min(total, page * PAGE_SIZE);
  const filtered = Boolean(query.q || query.ata);

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Catalog</h1>
          <p>
            <span className="num">{catalogSize.toLocaleString("en")}</span> part numbers with their limits and alternates.
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link href="/catalog/new" className="btn btn-primary">
            New part number
          </Link>
          <Link href="/catalog/import" className="btn btn-secondary">
            Import from CSV
          </Link>
        </div>
      </div>

      <form method="get" action="/catalog" className="panel flex flex-wrap items-end gap-3 p-3" role="search" aria-label="Catalog search">
        <div className="min-w-64 flex-1">
          <label htmlFor="q" className="field-label">
            Search by P/N or description
          </label>
          <input id="q" name="q" type="search" defaultValue={query.q ?? ""} className="field-input" maxLength={100} />
        </div>
        <div>
          <label htmlFor="ata" className="field-label">
            ATA chapter
          </label>
          <select id="ata" name="ata" defaultValue={query.ata ?? ""} className="field-input">
            <option value="">All chapters ({catalogSize})</option>
            {query.ata && query.ata.length > 2 ? <option value={query.ata}>{query.ata}</option> : null}
            {chapters.map((chapter) => (
              <option key={chapter.chapter} value={chapter.chapter}>
                {chapter.chapter} ({chapter.count})
              </option>
            ))}
          </select>
        </div>
        <input type="hidden" name="sort" value={sort} />
        <input type="hidden" name="dir" value={dir} />
        <button type="submit" className="btn btn-primary">
          Search
        </button>
        {filtered ? (
          <Link href="/catalog" className="btn btn-secondary">
            Clear
          </Link>
        ) : null}
      </form>
      {!parsed.success ? (
        <p role="alert" className="field-error">
          {parsed.error.issues[0]?.message} The filter was ignored.
        </p>
      ) : null}

      <p aria-live="polite">
        {total === 0 ? (
          "No part numbers match. Check the spelling, or clear the filters."
        ) : (
          <>
            Showing <span className="num">{first}</span>–<span className="num">{last}</span> of <span className="num">{total}</span>
            {filtered ? " matching" : ""} part numbers.
          </>
        )}
      </p>
      {total > 0 ? <CatalogTable partNumbers={partNumbers} sort={sort} dir={dir} hrefFor={(s, d) => href({ sort: s, dir: d, page: 1 })} /> : null}
      {total > PAGE_SIZE ? (
        <nav aria-label="Pages" className="flex gap-2">
          {page > 1 ? (
            <Link href={href({ page: page - 1 })} className="btn btn-secondary">
              ← Previous
            </Link>
          ) : null}
          {last < total ? (
            <Link href={href({ page: page + 1 })} className="btn btn-secondary">
              Next →
            </Link>
          ) : null}
        </nav>
      ) : null}
    </div>
  );
}
