// How the trace reads a thread: by airframe (from an installation to the removal from that
// aircraft) and by shop visit (from sent for repair to back from repair), with whatever happens
// in stores between them as its own stretch. Pure, so the page and the printed report group
// a thread the same way and a unit test pins the rule.

export interface GroupableEntry {
  seq: number;
  kind: string;
  registration: string | null;
  positionCode: string | null;
  details: Record<string, string> | null;
}

export type ThreadGroupKind = "airframe" | "shop" | "stores";

export interface ThreadGroup<E extends GroupableEntry> {
  kind: ThreadGroupKind;
  /** Aircraft and position of an airframe stretch; the shop of a shop visit. */
  registration: string | null;
  positionCode: string | null;
  shop: string | null;
  /** False while the stretch has not ended (still fitted, still at the shop). */
  closed: boolean;
  entries: E[];
}

/** Groups entries (already in seq order) into consecutive stretches. Corrections stay where they fall. */
export function groupThread<E extends GroupableEntry>(entries: readonly E[]): ThreadGroup<E>[] {
  const groups: ThreadGroup<E>[] = [];
  let open: ThreadGroup<E> | null = null;
  const start = (kind: ThreadGroupKind, e: E): ThreadGroup<E> => {
    const group: ThreadGroup<E> = {
      kind,
      registration: kind === "airframe" ? e.registration : null,
      positionCode: kind === "airframe" ? e.positionCode : null,
      shop: kind === "shop" ? (e.details?.shop ?? null) : null,
      closed: false,
      entries: [e],
    };
    groups.push(group);
    return group;
  };
  for (const e of entries) {
    if (e.kind === "installed") {
      open = start("airframe", e);
      continue;
    }
    if (e.kind === "sent_for_repair") {
      open = start("shop", e);
      continue;
    }
    if (open && !open.closed) {
      open.entries.push(e);
      if (open.kind === "airframe" && e.kind === "removed" && e.registration === open.registration) open.closed = true;
      if (open.kind === "shop" && e.kind === "repaired") open.closed = true;
      continue;
    }
    const last = groups[groups.length - 1];
    if (last && last.kind === "stores") last.entries.push(e);
    else open = start("stores", e);
  }
  for (const group of groups) if (group.kind === "stores") group.closed = true;
  return groups;
}
