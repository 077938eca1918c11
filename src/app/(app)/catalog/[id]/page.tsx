import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { FormMessage } from "@/components/catalog/form-field";
import { AlternatesEditor } from "@/components/catalog/alternates-editor";
import { PartNumberForm } from "@/components/catalog/part-number-form";
import { countUnits, countEligiblePositions, findPartNumber } from "@/server/catalog";
import { requireUserFor } from "@/server/page-guard";
import { removeAlternateAction, setAlternateAction, updatePartNumberAction } from "../actions";

export const metadata: Metadata = { title: "Part number" };

export default async function PartNumberPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { id: rawId } = await params;
  await requireUserFor("catalog", `/catalog/${rawId}`);
  const { created } = await searchParams;
  if (!/^\d{1,9}$/.test(rawId)) notFound();
  const id = Number(rawId);
  const partNumber = await findPartNumber(id);
  if (!partNumber) notFound();
  const [units, positions] = await Promise.all([countUnits(id), countEligiblePositions(id)]);

  return (
    <div className="max-w-5xl space-y-6">
      <p>
        <Link href="/catalog" className="underline">
          ← Catalog
        </Link>
      </p>
      <div>
        <h1 className="text-2xl font-bold">
          <span className="num">{partNumber.partNumber}</span> <span className="num text-lg font-semibold">CAGE {partNumber.cage}</span>
        </h1>
        <p className="text-lg">{partNumber.description}</p>
        <p>
          ATA <span className="num">{partNumber.ataChapter}</span> · <span className="num">{units.toLocaleString("en")}</span> serialised units on
          record · eligible at <span className="num">{positions.toLocaleString("en")}</span> positions
        </p>
      </div>
      {created ? (
        <FormMessage ok message="Part number added. Add its alternates below." />
      ) : null}
      <section aria-labelledby="details-heading" className="panel p-4">
        <h2 id="details-heading" className="mb-3 text-xl font-semibold">
          Details and limits
        </h2>
        <PartNumberForm action={updatePartNumberAction.bind(null, id)} current={partNumber} submitLabel="Save changes" />
      </section>
      <AlternatesEditor partNumber={partNumber} setAction={setAlternateAction.bind(null, id)} removeAction={removeAlternateAction} />
    </div>
  );
}
