import "server-only";
import { dateInZone, licenceSigningProblem, type LicenceHolder, type LicenceProblem } from "@/domain/licence";
import { AppError } from "./errors";

// For the swap recording: a signature (performing or countersigning) needs a licence or
// authorisation that has not expired. "Today" is read in the signer's station zone when the
// caller knows it, else in UTC.

export type { LicenceHolder, LicenceProblem };

export function licenceProblem(user: LicenceHolder, now: Date, timeZone = "UTC"): LicenceProblem | null {
  return licenceSigningProblem(user, dateInZone(now, timeZone));
}

/** Throws 409 `licence_expired` (or `licence_missing`) naming the expiry date, for the route wrapper to answer. */
export function assertLicenceValid(user: LicenceHolder, now: Date, timeZone = "UTC"): void {
  const problem = licenceProblem(user, now, timeZone);
  if (problem) throw new AppError("conflict", problem.message, problem.code);
}
