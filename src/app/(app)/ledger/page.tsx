import type { Metadata } from "next";
import { EntryHashCheck } from "@/components/trace/entry-hash-check";
import { LedgerCheck } from "@/components/trace/ledger-check";
import { requireUserFor } from "@/server/page-guard";

export const metadata: Metadata = { title: "Ledger check" };

export default async function LedgerPage() {
  await requireUserFor("ledger", "/ledger");
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Ledger check</h1>
      <p className="max-w-3xl">
        Every entry&apos;s hash is recomputed from its stored contents and the hash before it, from the first entry to the head. Any entry altered, removed or put out of
        order after it was written breaks the chain at that entry.
      </p>
      <LedgerCheck />
      <EntryHashCheck />
    </div>
  );
}
