import type { Metadata } from "next";
import Link from "next/link";
import { StatusBadge, statusWord } from "@/components/stock/status-badge";
import { StockRowActions } from "@/components/stock/stock-row-actions";
import { formatCycles, formatInstant } from "@/lib/format";
import { allowedMovements, STOCK_STATUSES, StockQuerySchema, type MovementKind, type StockQuery } from "@/lib/schemas/stock";
import { requireUserFor } from "@/server/page-guard";
import { listStock } from "@/server/stock";

export const metadata: Metadata = { title: "Stock" };

const LAST_KIND_WORDS: Record<string, string> = {
  received: "Received",
  issued: "Issued",
  installed: "Installed",
  removed: "Removed from aircraft",
  returned: "Taken back",
  sent_for_repair: "Sent for repair",
  repaired: "Back from repair",
  quarantined: "Quarantined",
  released: "Released",
  scrapped: "Scrapped",
  corrected: "Corrected",
};

function hrefWith(query: StockQuery, changes: Partial<Record<keyof StockQuery, string | number | undefined>>): string {
  const merged: Record<string, string | number | undefined> = { ...query, ...changes };
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(merged)) {
    if (value === undefined || value === "" || (key === "page" && value === 1) || (key === "pageSize" && value === 50)) continue;
    params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `/stock?${text}` : "/stock";
}

export default async function StockPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requireUserFor("stock", "/stock");
  const raw = Object.fromEntries(Object.entries(await searchParams).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]));
  const parsed = StockQuerySchema.safeParse(raw);
  const query: StockQuery = parsed.success ? parsed.data : StockQuerySchema.parse({});
  const page = await listStock(query);
  const inStores = page.counts.serviceable + page.counts.unserviceable + page.counts.quarantined + page.counts.in_repair;
  const first = page.total === 0 ? 0 : (page.page - 1) * page.pageSize + 1;
  const last = Math.min(page.total, page.page * page.pageSize);
  const pages = Math.max(1, Math.ceil(page.total / page.pageSize));

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h1 className="text-2xl font-bold">Stock</h1>
        {user.role === "stores" || user.role === "admin" ? (
          <Link href="/receiving" className="btn btn-primary">
            Receive a part
          </Link>
        ) : null}
      </div>
      {!parsed.success ? (
        <p role="alert" className="field-error">
          Some filters were not understood and were left out: {parsed.error.issues.map((i) => i.message).join(" ")}
        </p>
      ) : null}

      <nav aria-label="Status" className="flex flex-wrap gap-2">
        <Link href={hrefWith(query, { status: undefined, page: 1 })} aria-current={!query.status ? "page" : undefined} className="btn btn-secondary aria-[current=page]:border-[var(--accent)] aria-[current=page]:bg-[var(--accent)] aria-[current=page]:text-[var(--accent-ink)]">
          In stores and at shops <span className="num">({inStores.toLocaleString("en-GB")})</span>
        </Link>
        {STOCK_STATUSES.map((status) => (
          <Link key={status} href={hrefWith(query, { status, page: 1 })} aria-current={query.status === status ? "page" : undefined} className="btn btn-secondary aria-[current=page]:border-[var(--accent)] aria-[current=page]:bg-[var(--accent)] aria-[current=page]:text-[var(--accent-ink)]">
            {statusWord(status)} <span className="num">({page.counts[status].toLocaleString("en-GB")})</span>
          </Link>
        ))}
      </nav>

      <form method="get" className="panel flex flex-wrap items-end gap-3 p-3" role="search" aria-label="Filter stock">
        {query.status ? <input type="hidden" name="status" value={query.status} /> : null}
        <div>
          <label htmlFor="stock-pn" className="field-label">Part number starts with</label>
          <input id="stock-pn" name="partNumber" defaultValue={query.partNumber ?? ""} className="field-input num" autoComplete="off" />
        </div>
        <div>
          <label htmlFor="stock-bin" className="field-label">Bin starts with</label>
          <input id="stock-bin" name="bin" defaultValue={query.bin ?? ""} className="field-input num" autoComplete="off" />
        </div>
        <div>
          <label htmlFor="stock-serial" className="field-label">Serial number starts with</label>
          <input id="stock-serial" name="q" defaultValue={query.q ?? ""} className="field-input num" autoComplete="off" />
        </div>
        <button type="submit" className="btn btn-primary">Filter</button>
        <Link href={query.status ? `/stock?status=${query.status}` : "/stock"} className="btn btn-secondary">Clear</Link>
      </form>

      <p aria-live="polite">
        {page.total === 0 ? "No units match these filters." : <>Showing <span className="num">{first}–{last}</span> of <span className="num">{page.total.toLocaleString("en-GB")}</span> units</>}
      </p>

      {page.units.length > 0 ? (
        <div className="panel overflow-x-auto">
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">Units in stock with their status, part number, serial number and bin</caption>
            <thead className="sticky top-0 bg-[var(--panel)]">
              <tr className="border-b-2 border-[var(--ink-soft)]">
                {["Status", "P/N", "S/N", "Description", "Bin", "TSN", "CSN", "Last movement", "Actions"].map((heading) => (
                  <th key={heading} scope="col" className="px-3 py-2 font-semibold">{heading}</th>
                ))}
              </tr>
            </thead>
            <tbody>
              {page.units.map((unit) => {
                const kinds: MovementKind[] = allowedMovements({ status: unit.status, issued: unit.issuedTo !== null, lastKind: unit.lastMovement?.kind ?? null }, user.role);
                return (
                  <tr key={unit.id} className="border-b border-[var(--rule)] align-top">
                    <td className="px-3 py-2"><StatusBadge status={unit.status} /></td>
                    <td className="px-3 py-2 num whitespace-nowrap">{unit.partNumber}</td>
                    <td className="px-3 py-2 num whitespace-nowrap">
                      <Link href={`/parts/${unit.id}`} className="underline">{unit.serialNumber}</Link>
                    </td>
                    <td className="px-3 py-2">{unit.description}</td>
                    <td className="px-3 py-2">{unit.bin ? <span className="num">{unit.bin}</span> : unit.issuedTo ? "Out on issue" : unit.status === "in_repair" ? "At the shop" : unit.lastMovement?.kind === "removed" ? "Not yet back from the aircraft" : "—"}</td>
                    <td className="px-3 py-2 num">{unit.tsn}</td>
                    <td className="px-3 py-2 num">{formatCycles(unit.csn)}</td>
                    <td className="px-3 py-2 text-sm">
                      {unit.lastMovement ? (
                        <>
                          <span className="font-semibold">{LAST_KIND_WORDS[unit.lastMovement.kind] ?? unit.lastMovement.kind}</span>
                          {unit.issuedTo ? <> to <span className="num">{unit.issuedTo}</span></> : null}
                          <br />
                          {formatInstant(unit.lastMovement.occurredAt)}
                          {unit.lastMovement.reason ? <><br />{unit.lastMovement.reason}</> : null}
                        </>
                      ) : "—"}
                    </td>
                    <td className="px-3 py-2">
                      <StockRowActions unit={{ id: unit.id, partNumber: unit.partNumber, serialNumber: unit.serialNumber, bin: unit.bin }} kinds={kinds} />
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}

      {pages > 1 ? (
        <nav aria-label="Pages" className="flex flex-wrap items-center gap-3">
          {page.page > 1 ? <Link className="btn btn-secondary" href={hrefWith(query, { page: page.page - 1 })}>← Previous</Link> : null}
          <span>Page <span className="num">{page.page}</span> of <span className="num">{pages}</span></span>
          {page.page < pages ? <Link className="btn btn-secondary" href={hrefWith(query, { page: page.page + 1 })}>Next →</Link> : null}
        </nav>
      ) : null}
    </div>
  );
}
