import { describe, expect, it } from "vitest";
import { groupThread, type GroupableEntry } from "@/components/trace/thread-groups";

const e = (seq: number, kind: string, registration: string | null = null, details: Record<string, string> | null = null): GroupableEntry => ({
  seq,
  kind,
  registration,
  positionCode: registration ? "B1-EBA1" : null,
  details,
});

describe("groupThread", () => {
  it("reads a thread as stores, airframes and shop visits in order", () => {
    const groups = groupThread([
      e(1, "received"),
      e(2, "installed", "Q-TLAA"),
      e(3, "removed", "Q-TLAA"),
      e(4, "returned"),
      e(5, "sent_for_repair", null, { shop: "Invented Shop" }),
      e(6, "repaired"),
      e(7, "installed", "Q-TLBB"),
    ]);
    expect(groups.map((g) => [g.kind, g.registration, g.shop, g.closed, g.entries.map((x) => x.seq)])).toEqual([
      ["stores", null, null, true, [1]],
      ["airframe", "Q-TLAA", null, true, [2, 3]],
      ["stores", null, null, true, [4]],
      ["shop", null, "Invented Shop", true, [5, 6]],
      ["airframe", "Q-TLBB", null, false, [7]],
    ]);
  });

  it("keeps a correction where it falls and starts a new airframe at an installation with no removal before it", () => {
    const groups = groupThread([e(1, "received"), e(2, "installed", "Q-TLAA"), e(3, "corrected", "Q-TLAA"), e(4, "installed", "Q-TLCC"), e(5, "removed", "Q-TLAA")]);
    expect(groups.map((g) => [g.kind, g.registration, g.entries.map((x) => x.seq)])).toEqual([
      ["stores", null, [1]],
      ["airframe", "Q-TLAA", [2, 3]],
      ["airframe", "Q-TLCC", [4, 5]],
    ]);
  });

  it("gives nothing for an empty thread", () => {
    expect(groupThread([])).toEqual([]);
  });
});
