// Shapes the swap flow shares between the server's checks and the browser.
export type CheckLevel = "ok" | "warn" | "fail";

export interface SwapCheck {
  name: string;
  level: CheckLevel;
  message: string;
  /** The contract's 409 code when this check refuses the swap. */
  code?: string;
}

export interface SwapCheckResponse {
  checks: SwapCheck[];
  ok: boolean;
  fitted: { partNumber: string; serialNumber: string; cage: string } | null;
}

export interface SwapResponse {
  swap: {
    id: string;
    registration: string;
    positionCode: string;
    performedAt: string;
    performedBy: { id: string; name: string; licenceNumber: string | null };
    inspectionRequired: boolean;
    status: "complete" | "awaiting_inspection";
    removed: { partId: number; partNumber: string; serialNumber: string; tsn: string; csn: number } | null;
    installed: { partId: number; partNumber: string; serialNumber: string; tsn: string; csn: number } | null;
  };
  entries: Array<{ seq: number; kind: string; hash: string }>;
}

export interface AwaitingInspection {
  id: string;
  registration: string;
  positionCode: string;
  positionLabel: string;
  performedAt: string;
  performedBy: string;
  performedById: string;
  removed: string | null;
  installed: string | null;
  workOrder: string | null;
}

