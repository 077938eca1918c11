import type { Metadata } from "next";
import Link from "next/link";
import { PartNumberForm } from "@/components/catalog/part-number-form";
import { requireUserFor } from "@/server/page-guard";
import { createPartNumberAction } from "../actions";

export const metadata: Metadata = { title: "New part number" };

export default async function NewPartNumberPage() {
  await requireUserFor("catalog", "/catalog/new");
  return (
    <div className="max-w-4xl space-y-4">
      <p>
        <Link href="/catalog" className="underline">
          ← Catalog
        </Link>
      </p>
      <h1 className="text-2xl font-bold">New part number</h1>
      <p>Alternates are added on the part number&apos;s page once it is saved.</p>
      <div className="panel p-4">
        <PartNumberForm action={createPartNumberAction} submitLabel="Add part number" />
      </div>
    </div>
  );
}
