export interface SwapPosition {
  code: string;
  label: string;
  zone: string | null;
  ataChapter: string;
  cautions: string[];
  independentInspection: boolean;
  fitted: { partNumber: string; serialNumber: string; cage: string } | null;
}

export interface UnitReading {
  partNumber: string;
  serialNumber: string;
  cage: string | null;
}

export interface SwapDetails {
  hours: string;
  cycles: string;
  performedAt: string; // datetime-local value in the device's zone
  removalType: "scheduled" | "unscheduled" | null;
  reason: string;
  workOrder: string;
  taskReference: string;
  testResult: "passed" | "failed" | null;
}
