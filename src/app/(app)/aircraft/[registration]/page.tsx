import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { AirframeView } from "@/components/airframe/airframe-view";
import { UtilizationPanel } from "@/components/airframe/utilization-panel";
import { formatCycles, formatInstant } from "@/lib/format";
import { mayUse } from "@/lib/roles";
import { registrationParam } from "@/lib/schemas/common";
import { aircraftHeader, getPositionMap, listUtilization } from "@/server/aircraft";
import { AppError } from "@/server/errors";
import { requireUserFor } from "@/server/page-guard";

type Params = { params: Promise<{ registration: string }> };

export async function generateMetadata({ params }: Params): Promise<Metadata> {
  const { registration } = await params;
  return { title: registration.toUpperCase() };
}

export default async function AirframePage({ params }: Params) {
  const { registration: raw } = await params;
  const user = await requireUserFor("fleet", `/aircraft/${raw}`);
  const registration = registrationParam.safeParse(raw);
  if (!registration.success) notFound();
  let map;
  try {
    map = await getPositionMap(registration.data);
  } catch (error) {
    if (error instanceof AppError && error.kind === "not_found") notFound();
    throw error;
  }
  const snapshots = await listUtilization(registration.data, 5);
  const { aircraft } = map;
  return (
    <div className="space-y-4">
      <header className="flex flex-wrap items-end gap-x-6 gap-y-1">
        <h1 className="num text-3xl font-bold">{aircraft.registration}</h1>
        <p>
          <span className="num">{aircraft.type}</span> {aircraft.typeName} · MSN <span className="num">{aircraft.msn}</span> · {aircraft.stationName}
        </p>
        <p className="num">
          {aircraft.hours} h · {formatCycles(aircraft.cycles)} cycles
          <span className="font-sans text-sm"> as of {formatInstant(aircraft.asOf, aircraft.timeZone)}</span>
        </p>
        <Link href={`/aircraft/${encodeURIComponent(aircraft.registration)}/position-labels`} className="btn btn-secondary min-h-glove sm:ml-auto">
          Print position labels
        </Link>
      </header>
      <Suspense>
        <AirframeView
          initial={{
            aircraft: aircraftHeader(aircraft),
            positions: map.positions,
          }}
          canSwap={mayUse(user.role, "swap")}
        />
      </Suspense>
      <UtilizationPanel
        registration={aircraft.registration}
        timeZone={aircraft.timeZone}
        snapshots={snapshots}
        canRecord={["technician", "inspector", "admin"].includes(user.role)}
      />
    </div>
  );
}
