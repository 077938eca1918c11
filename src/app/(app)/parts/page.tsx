import type { Metadata } from "next";
import { PartSearch } from "@/components/parts/part-search";
import { requireUserFor } from "@/server/page-guard";

export const metadata: Metadata = { title: "Parts" };

export default async function PartsPage() {
  await requireUserFor("parts", "/parts");
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Find a unit</h1>
      <PartSearch />
    </div>
  );
}
