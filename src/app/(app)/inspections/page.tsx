import type { Metadata } from "next";
import { InspectionList } from "@/components/swap/inspection-list";
import { requireUserFor } from "@/server/page-guard";
import { listAwaitingInspection } from "@/server/swaps";

export const metadata: Metadata = { title: "Inspections" };

export default async function InspectionsPage() {
  const user = await requireUserFor("inspections", "/inspections");
  const waiting = await listAwaitingInspection();
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Independent inspections</h1>
      <p>
        Swaps at positions that require an independent inspection are complete only when an inspector other than the technician who did the work has inspected the task and countersigns here.
      </p>
      <InspectionList swaps={waiting} inspectorId={user.id} />
    </div>
  );
}
