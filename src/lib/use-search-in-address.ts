"use client";

import { usePathname } from "next/navigation";
import { useEffect } from "react";

/**
 * Keeps a screen's filters in the address, so a reload or a shared link shows the same list. The
 * native history call skips a server render that the screen's own query makes unnecessary. The
 * address is only replaced when it differs: a needless replacement just after the page loads can
 * cut short a link the user is already following.
 */
export function useSearchInAddress(search: string): void {
  const pathname = usePathname();
  useEffect(() => {
    const address = `${pathname}${search}`;
    if (`${window.location.pathname}${window.location.search}` !== address) window.history.replaceState(null, "", address);
  }, [pathname, search]);
}
