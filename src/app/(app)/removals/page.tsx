import type { Metadata } from "next";
import { RemovalsReport } from "@/components/reliability/removals-report";
import { RemovalFiltersSchema, RemovalListQuerySchema, type RemovalFilterValues } from "@/lib/schemas/reliability";
import { requireUserFor } from "@/server/page-guard";
import { listRemovals, removalFilterOptions } from "@/server/removals";

export const metadata: Metadata = { title: "Removals" };

const FILTER_NAMES = ["from", "to", "partNumber", "ataChapter", "registration", "aircraftType", "station", "removalType"] as const;

export default async function RemovalsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requireUserFor("removals", "/removals");
  const raw = await searchParams;
  const one = (name: string) => {
    const value = raw[name];
    return typeof value === "string" ? value : Array.isArray(value) ? value[0] : undefined;
  };
  const filterValues: RemovalFilterValues = Object.fromEntries(FILTER_NAMES.filter((name) => one(name)).map((name) => [name, one(name)]));
  const filters = RemovalFiltersSchema.safeParse(filterValues);
  const listQuery = RemovalListQuerySchema.safeParse({ page: one("page"), sort: one("sort"), dir: one("dir") });
  const page = listQuery.success ? listQuery.data : RemovalListQuerySchema.parse({});

  // Filters that do not parse are not run here: the browser asks the API, which names the bad field.
  const [initialData, options] = await Promise.all([filters.success ? listRemovals(filters.data, page) : Promise.resolve(null), removalFilterOptions()]);

  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold">Removals</h1>
        <p className="max-w-3xl">
          Every removal in the ledger with its time on wing, the unit fitted in its place and the shop&apos;s finding once the unit is back from repair.
          Instants are UTC. Hours and cycles on wing count from the unit&apos;s last installation at the same position.
        </p>
      </div>
      <RemovalsReport initialFilters={filterValues} initialPage={{ page: page.page, pageSize: page.pageSize, sort: page.sort, dir: page.dir }} initialData={initialData} options={options} />
    </div>
  );
}
