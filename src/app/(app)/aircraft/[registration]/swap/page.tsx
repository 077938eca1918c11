import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { SwapFlow } from "@/components/swap/swap-flow";
import { registrationParam } from "@/lib/schemas/common";
import { getPositionMap } from "@/server/aircraft";
import { db } from "@/server/db";
import { AppError } from "@/server/errors";
import { requireUserFor } from "@/server/page-guard";

export const metadata: Metadata = { title: "Swap" };

type Props = { params: Promise<{ registration: string }>; searchParams: Promise<{ position?: string }> };

export default async function SwapPage({ params, searchParams }: Props) {
  const [{ registration: raw }, { position }] = await Promise.all([params, searchParams]);
  const user = await requireUserFor("swap", `/aircraft/${raw}/swap${position ? `?position=${encodeURIComponent(position)}` : ""}`);
  const registration = registrationParam.safeParse(raw);
  if (!registration.success) notFound();
  let map;
  try {
    map = await getPositionMap(registration.data);
  } catch (error) {
    if (error instanceof AppError && error.kind === "not_found") notFound();
    throw error;
  }
  const recentWorkOrders = await db()("ledger_entries")
    .where({ aircraft_id: map.aircraft.id })
    .whereNotNull("work_order")
    .orderBy("seq", "desc")
    .limit(40)
    .pluck("work_order");
  const known = map.positions.some((p) => p.code === position);
  return (
    <div className="mx-auto max-w-2xl">
      <h1 className="sr-only">Record a swap on {map.aircraft.registration}</h1>
      <SwapFlow
        registration={map.aircraft.registration}
        positions={map.positions.map((p) => ({
          code: p.code,
          label: p.label,
          zone: p.zone,
          ataChapter: p.ataChapter,
          cautions: p.cautions,
          independentInspection: p.independentInspection,
          fitted: p.fitted ? { partNumber: p.fitted.partNumber, serialNumber: p.fitted.serialNumber, cage: p.fitted.cage } : null,
        }))}
        initialPositionCode={known ? position! : null}
        latest={{ hours: map.aircraft.hours, cycles: map.aircraft.cycles }}
        signer={{ name: user.name, licenceNumber: user.licenceNumber }}
        recentWorkOrders={[...new Set(recentWorkOrders as string[])].slice(0, 4)}
      />
    </div>
  );
}
