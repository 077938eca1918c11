import "server-only";
import { headers } from "next/headers";

/** The client's address for rate limits and the audit trail, as the route wrapper's clientIp reads it. */
export function clientAddressFrom(h: Headers): string {
  return (h.get("x-forwarded-for")?.split(",")[0] ?? h.get("x-real-ip") ?? "local").trim().slice(0, 64);
}

/** For server actions, which have no request object. */
export async function actionClientAddress(): Promise<string> {
  return clientAddressFrom(await headers());
}
