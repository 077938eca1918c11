import type { Metadata } from "next";
import { requireUserFor } from "@/server/page-guard";
import { LabelCheck } from "./label-check";

export const metadata: Metadata = { title: "Label check" };

export default async function LabelCheckPage() {
  await requireUserFor("home", "/scan-check");
  return (
    <div className="mx-auto max-w-2xl space-y-4">
      <div>
        <h1 className="text-2xl font-bold">Label check</h1>
        <p className="mt-1 text-lg">
          Try a part label and this device&apos;s camera before a job: see what Threadline reads from the label. Nothing
          is recorded.
        </p>
      </div>
      <LabelCheck />
    </div>
  );
}
