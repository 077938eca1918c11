// The release certificates of the simulated history: one per receipt and per return from repair,
// numbered in time order. Seed 03 uploads them while the replay writes their `documents` rows, so
// both sides build the same list from the same (deterministic) history.
import { demoCertificatePdf, sha256 } from "./certificates";
import type { HistoryEvent, SimulatedCertificate } from "./history";

export interface HistoryCertificate {
  id: number;
  partId: number;
  key: string;
  trackingNumber: string;
  issuedOn: string;
  certificate: SimulatedCertificate;
  body: Buffer;
  sha256: string;
}

export function historyCertificates(events: readonly HistoryEvent[]): Map<HistoryEvent, HistoryCertificate> {
  const labels = new Map<number, { partNumber: string; serialNumber: string }>();
  const result = new Map<HistoryEvent, HistoryCertificate>();
  for (const event of events) {
    if (event.type === "received") labels.set(event.part.id, event.part);
    if ((event.type !== "received" && event.type !== "stock") || !event.certificate) continue;
    const id = result.size + 1;
    const number = String(id).padStart(6, "0");
    const trackingNumber = `${event.type === "received" ? "RC" : "RR"}-${number}`;
    const issuedOn = new Date(event.at).toISOString().slice(0, 10);
    const part = labels.get(event.entry.partId)!;
    const body = demoCertificatePdf([
      "AUTHORISED RELEASE CERTIFICATE (demo document, invented)",
      `Form tracking number: ${trackingNumber}`,
      `Organisation: ${event.certificate.issuerName} (${event.certificate.issuerApproval})`,
      `Part number: ${part.partNumber}   Serial number: ${part.serialNumber}`,
      `Status/work: ${event.certificate.statusWork}`,
      `Date: ${issuedOn}`,
    ]);
    result.set(event, { id, partId: event.entry.partId, key: `demo-certificates/${number}.pdf`, trackingNumber, issuedOn, certificate: event.certificate, body, sha256: sha256(body) });
  }
  return result;
}
