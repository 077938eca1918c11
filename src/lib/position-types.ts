// Shapes of an aircraft's positions as the API sends them and the position map shows them.
import type { LifeStatus } from "@/domain/life";

export type PositionState = "fitted" | "empty" | "near_limit" | "past_limit" | "finding";

export interface FittedUnit {
  partId: number;
  partNumber: string;
  serialNumber: string;
  cage: string;
  description: string;
  installedAt: string;
  hoursOnWing: string;
  cyclesOnWing: number;
  tsn: string;
  csn: number;
  tso: string | null;
  cso: number | null;
  life: { status: LifeStatus; hoursRemaining: string | null; cyclesRemaining: number | null; daysRemaining: number | null };
}

export interface MapPosition {
  id: number;
  code: string;
  label: string;
  parentCode: string | null;
  ataChapter: string;
  zone: string | null;
  x: number;
  y: number;
  cautions: string[];
  independentInspection: boolean;
  eligible: string[];
  fitted: FittedUnit | null;
  state: PositionState;
  findings: number;
}

