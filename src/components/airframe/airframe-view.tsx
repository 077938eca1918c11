"use client";

import { useQuery } from "@tanstack/react-query";
import { useRouter, useSearchParams } from "next/navigation";
import { useState } from "react";
import { PositionMap, WHOLE_AIRCRAFT } from "@/components/position-map/position-map";
import type { AircraftDetailResponse } from "@/lib/api-types";
import { aircraftQuery } from "@/lib/queries";
import { PositionDetail } from "./position-detail";
import { PositionTable } from "./position-table";

/** The Airframe page's live part: map, selected position and table, refreshed through TanStack Query. */
export function AirframeView({ initial, canSwap }: { initial: AircraftDetailResponse; canSwap: boolean }) {
  const registration = initial.aircraft.registration;
  const { data } = useQuery({ ...aircraftQuery(registration), initialData: initial });
  const router = useRouter();
  const search = useSearchParams();
  const selectedCode = search.get("position");
  const [zone, setZone] = useState<string>(() => data.positions.find((p) => p.code === selectedCode)?.zone ?? WHOLE_AIRCRAFT);
  const selected = data.positions.find((p) => p.code === selectedCode) ?? null;

  const select = (code: string) => {
    const position = data.positions.find((p) => p.code === code);
    if (position?.zone && zone === WHOLE_AIRCRAFT) setZone(position.zone);
    router.replace(`?position=${encodeURIComponent(code)}`, { scroll: false });
  };

  return (
    <div className="space-y-6">
      <div className="grid gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <PositionMap positions={data.positions} zone={zone} onZoneChange={setZone} selectedCode={selectedCode} onSelect={select} />
        <div>
          {selected ? (
            <PositionDetail
              position={selected}
              timeZone={data.aircraft.timeZone}
              swapHref={canSwap ? `/aircraft/${encodeURIComponent(registration)}/swap?position=${encodeURIComponent(selected.code)}` : null}
              labelHref={`/aircraft/${encodeURIComponent(registration)}/position-labels?position=${encodeURIComponent(selected.code)}`}
            />
          ) : (
            <p className="panel p-4">Tap a position on the map, or pick one in the table, to see what is fitted there.</p>
          )}
        </div>
      </div>
      <PositionTable positions={data.positions} selectedCode={selectedCode} onSelect={select} />
    </div>
  );
}
