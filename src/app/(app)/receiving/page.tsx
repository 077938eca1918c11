import type { Metadata } from "next";
import { ReceiptForm } from "@/components/receiving/receipt-form";
import { requireUserFor } from "@/server/page-guard";
import { listCatalogPartNumbers } from "@/server/receiving";

export const metadata: Metadata = { title: "Receiving" };

export default async function ReceivingPage() {
  await requireUserFor("receiving", "/receiving");
  const catalog = await listCatalogPartNumbers();
  return (
    <div className="mx-auto max-w-6xl space-y-4">
      <h1 className="text-2xl font-bold">Receiving</h1>
      <ReceiptForm catalog={catalog.map(({ partNumber, cage, description }) => ({ partNumber, cage, description }))} />
    </div>
  );
}
