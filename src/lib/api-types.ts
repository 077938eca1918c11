// Response shapes of the JSON API as the browser sees them (types only: no server code comes along).
import type { MapPosition } from "@/lib/position-types";
import type { PartDetail, PartSummary } from "@/server/parts";

export interface AircraftHeader {
  registration: string;
  msn: string;
  type: string;
  typeName: string;
  station: string;
  timeZone: string;
  hours: string;
  cycles: number;
  asOf: string | null;
}

export interface AircraftDetailResponse {
  aircraft: AircraftHeader;
  positions: MapPosition[];
}

export interface PartSearchResponse {
  parts: PartSummary[];
}

export interface PartDetailResponse {
  part: PartDetail;
}

export type { MapPosition, PartDetail, PartSummary };
