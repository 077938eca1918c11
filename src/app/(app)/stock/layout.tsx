import type { ReactNode } from "react";
import { requireUserFor } from "@/server/page-guard";

// The role check runs here as well as in the page: a layout renders before loading.tsx starts
// streaming, so a role that may not use stock gets a real 403 status, not a 200 with the 403 page.
export default async function StockLayout({ children }: { children: ReactNode }) {
  await requireUserFor("stock", "/stock");
  return children;
}
