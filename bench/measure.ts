// Timing and reporting helpers for `npm run bench`. Nothing here asserts: figures are reported.
import { readFileSync, readdirSync } from "node:fs";

export interface Figure {
  name: string;
  unit: string;
  threadline: number | null;
  baseline: number | null;
  /** threadline ÷ baseline, always in that order; the goal says which way is good. */
  ratio: number | null;
  goal: string;
  met: boolean | null;
  note?: string;
}

export const p50 = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

/** Wall time of each call, one after the other (ms). */
export async function timeEach(count: number, once: (i: number) => Promise<void>): Promise<number[]> {
  const times: number[] = [];
  for (let i = 0; i < count; i++) {
    const started = performance.now();
    await once(i);
    times.push(performance.now() - started);
  }
  return times;
}

/** Calls per second with `clients` callers working through `count` calls together. */
export async function throughput(count: number, clients: number, once: (i: number) => Promise<void>): Promise<number> {
  let next = 0;
  const started = performance.now();
  await Promise.all(Array.from({ length: clients }, async () => { while (next < count) await once(next++); }));
  return count / ((performance.now() - started) / 1000);
}

/**
 * Calls per second of each side with `clients` callers, the sides taking turns in rounds (as
 * `interleaved` does for latencies), so that a slow spell of the machine falls on both alike.
 * `around` wraps each side's turn (to count what happened during it).
 */
export async function interleavedThroughput(
  rounds: number,
  perRound: number,
  clients: number,
  a: (i: number) => Promise<void>,
  b: (i: number) => Promise<void>,
  around: (side: "a" | "b", turn: () => Promise<void>) => Promise<void> = (_, turn) => turn(),
): Promise<[number, number]> {
  const seconds = { a: 0, b: 0 };
  for (let r = 0; r < rounds; r++) {
    for (const [side, once] of [["a", a], ["b", b]] as const) {
      await around(side, async () => {
        let next = 0;
        const started = performance.now();
        await Promise.all(Array.from({ length: clients }, async () => { while (next < perRound) await once(r * perRound + next++); }));
        seconds[side] += (performance.now() - started) / 1000;
      });
    }
  }
  return [(rounds * perRound) / seconds.a, (rounds * perRound) / seconds.b];
}

/** Alternates the two sides in rounds, so a burst of load on the machine falls on both alike. */
export async function interleaved(rounds: number, perRound: number, a: (i: number) => Promise<void>, b: (i: number) => Promise<void>): Promise<[number[], number[]]> {
  const timesA: number[] = [];
  const timesB: number[] = [];
  for (let r = 0; r < rounds; r++) {
    timesA.push(...(await timeEach(perRound, (i) => a(r * perRound + i))));
    timesB.push(...(await timeEach(perRound, (i) => b(r * perRound + i))));
  }
  return [timesA, timesB];
}

/** A figure whose goal reads "<= x" or ">= x" on threadline ÷ baseline (or on threadline alone when there is no baseline). */
export function figure(name: string, unit: string, threadline: number | null, baseline: number | null, goal: string, note?: string): Figure {
  const limit = Number(goal.replace(/[^0-9.]/g, ""));
  const ratio = threadline !== null && baseline !== null && baseline !== 0 ? Math.round((threadline / baseline) * 100) / 100 : null;
  const judged = baseline === null ? threadline : ratio;
  const met = judged === null ? null : goal.startsWith(">=") ? judged >= limit : judged <= limit;
  const round = (v: number | null) => (v === null ? null : Math.round(v * 100) / 100);
  return { name, unit, threadline: round(threadline), baseline: round(baseline), ratio, goal, met, ...(note ? { note } : {}) };
}

/** Resident set size (bytes) of a process and all its descendants, from /proc. */
export function treeRss(rootPid: number): number {
  const children = new Map<number, number[]>();
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, "utf8");
      const parent = Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]);
      children.set(parent, [...(children.get(parent) ?? []), Number(entry)]);
    } catch {
      // the process ended while we looked
    }
  }
  let total = 0;
  const stack = [rootPid];
  while (stack.length) {
    const pid = stack.pop()!;
    try {
      const rss = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"));
      total += rss ? Number(rss[1]) * 1024 : 0;
    } catch {
      // gone
    }
    stack.push(...(children.get(pid) ?? []));
  }
  return total;
}

/** Samples a value every `everyMs` while `work` runs; returns the work's result and the highest sample. */
export async function peakWhile<T>(sample: () => number, everyMs: number, work: () => Promise<T>): Promise<{ result: T; peak: number }> {
  let peak = sample();
  const timer = setInterval(() => { peak = Math.max(peak, sample()); }, everyMs);
  try {
    const result = await work();
    peak = Math.max(peak, sample());
    return { result, peak };
  } finally {
    clearInterval(timer);
  }
}

export function printTable(figures: Figure[]): void {
  const pad = (v: unknown, n: number) => String(v ?? "-").padEnd(n);
  const value = (v: number | null) => (v === null ? null : Math.abs(v) >= 1000 ? Math.round(v) : v);
  console.log(`\n${pad("figure", 58)}${pad("unit", 11)}${pad("threadline", 12)}${pad("baseline", 12)}${pad("ratio", 7)}${pad("goal", 10)}met`);
  for (const f of figures) {
    console.log(`${pad(f.name, 58)}${pad(f.unit, 11)}${pad(value(f.threadline), 12)}${pad(value(f.baseline), 12)}${pad(f.ratio, 7)}${pad(f.goal, 10)}${f.met ?? "-"}`);
    if (f.note) console.log(`    ${f.note}`);
  }
}
