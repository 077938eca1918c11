import "server-only";
import type { User } from "lucia";
import type { Trx } from "./db";
import { serverEnv } from "./env";
import type { OutgoingMail } from "./mail";

// Mail to the people who must act: quality (every active auditor) on a quarantine, administrators on catalog requests.

export async function emailsOfRole(trx: Trx, role: "auditor" | "admin"): Promise<string[]> {
  const rows = await trx("users").where({ role, status: "active" }).select("email");
  return rows.map((r) => r.email);
}

/** Mail to quality (every active auditor) about a unit put in quarantine. */
export async function quarantineMail(
  trx: Trx,
  input: { partId: number; partNumber: string; serialNumber: string; reason: string; actor: User; context: string },
): Promise<OutgoingMail[]> {
  const link = `${serverEnv().APP_URL}/parts/${input.partId}`;
  return (await emailsOfRole(trx, "auditor")).map((to) => ({
    to,
    subject: `Quarantined: P/N ${input.partNumber} S/N ${input.serialNumber} (${input.context})`,
    text: [
      `${input.actor.name} put this unit in quarantine (${input.context}).`,
      "",
      `Part number: ${input.partNumber}`,
      `Serial number: ${input.serialNumber}`,
      `Reason: ${input.reason}`,
      "",
      `The unit may not be fitted until quality releases it: ${link}`,
    ].join("\n"),
  }));
}
