import "server-only";
import { db, type Trx } from "./db";
import { checkFindingCounts } from "./trace";

// Findings counts for screens that show many units at once (the position map, the fleet list),
// read from the thread_findings cache and re-checked only where a unit's thread or the catalog
// changed since the count was made (see the migration that creates the cache for what "changed"
// covers). Reading the revision and the units' newest seqs *before* re-checking means a count is
// never stored as newer than the facts it was made from; at worst it is re-checked once more.

const UPSERT_ROWS = 1_000;
const LOOKUP_IDS = 5_000;

interface CacheState {
  partId: number;
  lastSeq: number;
  cached: { count: number; throughSeq: number; revision: number } | null;
}

async function readCacheState(partIds: number[], trx: Trx): Promise<{ revision: number; states: CacheState[] }> {
  const [revisionRow] = await trx("catalog_revision").where({ id: 1 }).select("revision");
  const states: CacheState[] = [];
  for (let start = 0; start < partIds.length; start += LOOKUP_IDS) {
    const ids = partIds.slice(start, start + LOOKUP_IDS);
    const [rows] = await trx.raw(
      `SELECT p.id, (SELECT MAX(e.seq) FROM ledger_entries e WHERE e.part_id = p.id) AS last_seq,
              tf.finding_count, tf.through_seq, tf.catalog_revision
         FROM parts p LEFT JOIN thread_findings tf ON tf.part_id = p.id
        WHERE p.id IN (${ids.map(() => "?").join(",")})`,
      ids,
    );
    for (const row of rows as Array<Record<string, number | string | null>>) {
      states.push({
        partId: Number(row.id),
        lastSeq: Number(row.last_seq ?? 0),
        cached: row.finding_count === null ? null : { count: Number(row.finding_count), throughSeq: Number(row.through_seq), revision: Number(row.catalog_revision) },
      });
    }
  }
  return { revision: Number(revisionRow?.revision ?? 0), states };
}

/** Findings per unit for the given units, from the cache where it still holds. */
export async function countFindings(partIds: number[], trx: Trx = db()): Promise<Map<number, number>> {
  const counts = new Map<number, number>();
  if (partIds.length === 0) return counts;
  const { revision, states } = await readCacheState([...new Set(partIds)], trx);

  const stale: CacheState[] = [];
  for (const state of states) {
    const valid = state.cached && state.cached.throughSeq === state.lastSeq && state.cached.revision === revision;
    if (valid) counts.set(state.partId, state.cached!.count);
    else stale.push(state);
  }
  if (stale.length === 0) return counts;

  const fresh = await checkFindingCounts(stale.map((s) => s.partId), trx);
  for (const [partId, count] of fresh) counts.set(partId, count);
  await storeCounts(
    stale.map((s) => ({ partId: s.partId, throughSeq: s.lastSeq, count: fresh.get(s.partId) ?? 0 })),
    revision,
  );
  return counts;
}

/**
 * Writes re-checked counts outside the caller's transaction (a cache write must never hold up or
 * roll back the work it serves); a failed write only means the next read checks those units again.
 * A row is only replaced, as a whole, by one made from the same or a newer thread and catalog.
 */
// MariaDB applies the assignments left to right; the condition still holds (or fails) alike for
// each of them, since a replaced through_seq or revision equals the new value it was compared with.
const NEWER = "VALUES(through_seq) >= through_seq AND VALUES(catalog_revision) >= catalog_revision";

async function storeCounts(rows: Array<{ partId: number; throughSeq: number; count: number }>, revision: number): Promise<void> {
  const now = new Date();
  try {
    for (let start = 0; start < rows.length; start += UPSERT_ROWS) {
      const slice = rows.slice(start, start + UPSERT_ROWS);
      await db().raw(
        `INSERT INTO thread_findings (part_id, through_seq, catalog_revision, finding_count, computed_at)
         VALUES ${slice.map(() => "(?, ?, ?, ?, ?)").join(", ")}
         ON DUPLICATE KEY UPDATE
           finding_count = IF(${NEWER}, VALUES(finding_count), finding_count),
           computed_at = IF(${NEWER}, VALUES(computed_at), computed_at),
           through_seq = IF(${NEWER}, VALUES(through_seq), through_seq),
           catalog_revision = IF(${NEWER}, VALUES(catalog_revision), catalog_revision)`,
        slice.flatMap((r) => [r.partId, r.throughSeq, revision, r.count, now]),
      );
    }
  } catch (error) {
    console.error("thread findings cache: could not store counts", error);
  }
}
