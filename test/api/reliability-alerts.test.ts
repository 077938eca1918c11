import { beforeAll, describe, expect, it } from "vitest";
import { http, signInAs, testDb } from "../support/api";
import { inbox, waitForMail, type InboxMail } from "../support/mail-inbox";
import { fittedAt, latestTotals, postSwap, spares, swapBody } from "../support/swaps";

let reliability: string;
let technician: string;
beforeAll(async () => {
  [reliability, technician] = await Promise.all([signInAs("reliability"), signInAs("technician")]);
});

const SUBJECT = "Alert level crossed: QF-3242-50 unscheduled removals in 2026-10";
const isOctoberAlert = (mail: InboxMail) => mail.subject === SUBJECT && mail.to.some((t) => t.address === "reliability@demo.threadline.test");

/** Waits (bounded) until the outbox has sent every queued mail with this subject. */
async function outboxSent(subject: string) {
  for (let attempt = 0; attempt < 200; attempt++) {
    const unsent = await testDb()("mail_outbox").where({ subject }).whereNull("sent_at").count({ count: "*" });
    if (Number(unsent[0].count) === 0) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`mail "${subject}" was not sent`);
}

describe("alert mail when a month closes above its alert level", () => {
  it("mails the reliability engineers once per part number and month, however often it is checked", async () => {
    // The rates API checks the asked-for group before it answers.
    const first = await http().get("/api/reliability?partNumber=QF-3242-50&from=2025-12-01&to=2026-11-30").set("cookie", reliability);
    expect(first.status).toBe(200);
    expect(first.body.monthsAboveAlert).toContain("2026-10");

    const rows = await testDb()("reliability_alerts as ra").join("part_numbers as pn", "pn.id", "ra.part_number_id").select("pn.part_number", "ra.month", "ra.rate_per_1000", "ra.alert_level");
    const october = rows.find((r) => r.part_number === "QF-3242-50" && r.month === "2026-10");
    expect(october).toBeDefined();
    expect(Number(october.rate_per_1000)).toBeGreaterThan(Number(october.alert_level));
    // Its two-way alternate is the same group: no second alert under QF-3242-51.
    expect(rows.filter((r) => r.part_number === "QF-3242-51")).toEqual([]);

    const mail = await waitForMail(isOctoberAlert);
    expect(mail.text).toMatch(/closed 2026-10 above its alert level/);
    expect(mail.text).toMatch(/with alternates QF-3242-51/);
    expect(mail.text).toMatch(/AC 120-17B/);

    // Check again by every door: the rates API for the P/N and its alternate, and an unscheduled removal.
    await http().get("/api/reliability?partNumber=QF-3242-50").set("cookie", reliability);
    await http().get("/api/reliability?partNumber=QF-3242-51&from=2025-12-01&to=2026-11-30").set("cookie", reliability);
    const off = await fittedAt("Q-FRBD", "B1-EBA1");
    const [on] = await spares(["QF-3242-50", "QF-3242-51"], 1);
    const totals = await latestTotals("Q-FRBD");
    const swap = await postSwap(technician, swapBody({ registration: "Q-FRBD", positionCode: "B1-EBA1", minutes: totals.minutes + 20, cycles: totals.cycles + 1, removed: off, installed: on }));
    expect(swap.status, swap.text).toBe(201);
    await http().get("/api/reliability?partNumber=QF-3242-50&from=2025-12-01&to=2026-11-30").set("cookie", reliability);

    const queued = await testDb()("mail_outbox").where({ subject: SUBJECT, to_address: "reliability@demo.threadline.test" }).count({ count: "*" });
    expect(Number(queued[0].count)).toBe(1);
    const [{ count: alertRows }] = await testDb()("reliability_alerts as ra").join("part_numbers as pn", "pn.id", "ra.part_number_id").where({ "pn.part_number": "QF-3242-50", "ra.month": "2026-10" }).count({ count: "*" });
    expect(Number(alertRows)).toBe(1);
    await outboxSent(SUBJECT);
    expect((await inbox()).filter(isOctoberAlert)).toHaveLength(1);
  });

  it("marks a quiet part's single removal above a zero alert level on the page, but mails nothing for it", async () => {
    // QF-7931-10 comes off rarely: one unscheduled removal in 2026-09 is enough to cross mean + 2 SD of its quiet year.
    const { body } = await http().get("/api/reliability?partNumber=QF-7931-10&from=2025-12-01&to=2026-11-30").set("cookie", reliability);
    const single = body.months.filter((m: { closed: boolean; aboveAlert: boolean; unscheduledRemovals: number }) => m.closed && m.aboveAlert && m.unscheduledRemovals < 2);
    expect(single.length).toBeGreaterThan(0);
    const rows = await testDb()("reliability_alerts as ra")
      .join("part_numbers as pn", "pn.id", "ra.part_number_id")
      .where("pn.part_number", "QF-7931-10")
      .whereIn("ra.month", single.map((m: { month: string }) => m.month));
    expect(rows).toEqual([]);
  });
});
