import type { Metadata } from "next";
import Link from "next/link";
import { CsvImport } from "@/components/catalog/csv-import";
import { CSV_COLUMNS, CSV_EXAMPLE, CSV_TEMPLATE, IMPORT_MAX_ROWS } from "@/lib/schemas/catalog-csv";
import { requireUserFor } from "@/server/page-guard";

export const metadata: Metadata = { title: "Import part numbers" };

const csvHref = (text: string) => `data:text/csv;charset=utf-8,${encodeURIComponent(text)}`;

const COLUMN_HELP: Record<(typeof CSV_COLUMNS)[number], string> = {
  part_number: "Required. Letters, digits, '-', '/' and '.'.",
  cage: "Required. CAGE or manufacturer code, 5 letters or digits.",
  description: "Required. Up to 200 characters.",
  ata_chapter: "Required. Chapter-section, like 32-42 or 32-42-01.",
  serialised: "yes or no; blank means yes. Part numbers with limits must be serialised.",
  life_limit_hours: "H:MM (30000:00) or decimal hours (1234.5); blank for none.",
  life_limit_cycles: "Whole number; blank for none.",
  life_limit_days: "Whole number of calendar days; blank for none.",
  overhaul_hours: "H:MM or decimal hours; blank for none.",
  overhaul_cycles: "Whole number; blank for none.",
  alternates: "P/N:one-way or P/N:two-way, separated by ';'. One-way means the alternate may replace this P/N, not the reverse. Write P/N@CAGE when the P/N exists under several CAGE codes. An alternate must be in the catalog or in the same file.",
};

export default async function ImportPage() {
  await requireUserFor("catalog", "/catalog/import");
  return (
    <div className="max-w-5xl space-y-4">
      <p>
        <Link href="/catalog" className="underline">
          ← Catalog
        </Link>
      </p>
      <h1 className="text-2xl font-bold">Import part numbers from CSV</h1>
      <p>
        Each good row is added with its alternates; a row with a problem is reported and nothing of it is written. Rows already in the catalog
        are reported, not changed: edit those on their own page. The file is sent in parts of at most <span className="num">{IMPORT_MAX_ROWS}</span> rows.
      </p>
      <div className="flex flex-wrap gap-2">
        <a href={csvHref(CSV_TEMPLATE)} download="catalog-template.csv" className="btn btn-secondary">
          Download the template (header only)
        </a>
        <a href={csvHref(CSV_EXAMPLE)} download="catalog-example.csv" className="btn btn-secondary">
          Download an example file
        </a>
      </div>
      <CsvImport />
      <details className="panel p-4">
        <summary className="min-h-touch cursor-pointer font-semibold">The columns</summary>
        <table className="mt-2 w-full border-collapse text-left">
          <tbody>
            {CSV_COLUMNS.map((column) => (
              <tr key={column} className="border-b border-[var(--rule)]">
                <th scope="row" className="num py-1.5 pr-4 align-top">
                  {column}
                </th>
                <td className="py-1.5">{COLUMN_HELP[column]}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </div>
  );
}
