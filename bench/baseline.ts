// The bare baseline: a node:http server over a mysql2 pool, with no framework, no query builder and
// no validation library, answering each benchmarked route with the same SQL statements the app runs
// for it (read off the app with the general log; `npm run bench -- --show-sql` prints both lists).
// Its answers are as large as the app's, so the ratio is the cost of everything around the SQL.
import http from "node:http";
import { randomUUID } from "node:crypto";
import mysql from "mysql2/promise";
import { chainEntry } from "../src/domain/ledger-hash";
import { entryToRow } from "../src/lib/ledger-rows";

type Row = Record<string, unknown>;
type Conn = mysql.Pool | mysql.PoolConnection;

async function rows(conn: Conn, sql: string, values: unknown[] = []): Promise<Row[]> {
  const [result] = await conn.execute(sql, values as never[]);
  return result as Row[];
}

/** The session lookup the app's sign-in library makes: the session, then its user. */
async function sessionUser(conn: Conn, sessionId: string): Promise<Row> {
  await rows(conn, "SELECT * FROM `user_sessions` WHERE id = ?", [sessionId]);
  const [user] = await rows(conn, "SELECT `users`.* FROM `user_sessions` INNER JOIN `users` ON `users`.id = `user_sessions`.user_id WHERE `user_sessions`.id = ?", [sessionId]);
  if (!user) throw new Error("no session");
  return user;
}

const inList = (values: unknown[]) => values.map(() => "?").join(",") || "NULL";

/** GET /api/parts/{id}/trace: the unit, its entries with their display joins, and the facts the continuity check reads. */
async function trace(pool: mysql.Pool, sessionId: string, partId: number) {
  await sessionUser(pool, sessionId);
  const [part, entries, positions, aircraft] = await Promise.all([
    rows(pool, "SELECT pt.id, pt.serial_number, pt.status, pt.manufactured_on, pn.id AS pn_id, pn.part_number, pn.cage, pn.description, pn.ata_chapter, pn.life_limit_minutes, pn.life_limit_cycles, pn.life_limit_days FROM parts pt JOIN part_numbers pn ON pn.id = pt.part_number_id WHERE pt.id IN (?)", [partId]),
    rows(
      pool,
      `SELECT e.*, d.kind AS document_kind, a.registration, p.code AS position_code, p.label AS position_label, us.name AS signer_name, us.licence_number AS signer_licence,
              d.form_type AS document_form_type, d.tracking_number AS document_tracking_number, d.status_work AS document_status_work, d.issuer_name AS document_issuer_name,
              d.issuer_approval AS document_issuer_approval, d.sha256 AS document_sha256
         FROM ledger_entries e LEFT JOIN documents d ON d.id = e.document_id LEFT JOIN aircraft a ON a.id = e.aircraft_id
         LEFT JOIN positions p ON p.id = e.position_id LEFT JOIN users us ON us.id = e.recorded_by
        WHERE e.part_id IN (?) ORDER BY e.seq`,
      [partId],
    ),
    rows(pool, "SELECT p.id, p.code FROM positions p WHERE p.id IN (SELECT DISTINCT position_id FROM ledger_entries WHERE part_id IN (?) AND position_id IS NOT NULL)", [partId]),
    rows(pool, "SELECT a.id, a.aircraft_type_id, a.registration FROM aircraft a WHERE a.id IN (SELECT DISTINCT aircraft_id FROM ledger_entries WHERE part_id IN (?) AND aircraft_id IS NOT NULL)", [partId]),
  ]);
  const pnId = part[0]?.pn_id;
  const eligibility = await rows(
    pool,
    `SELECT pe.part_number_id AS pn_id, pe.position_id, p.aircraft_type_id FROM position_eligibility pe JOIN positions p ON p.id = pe.position_id WHERE pe.part_number_id IN (?)
     UNION SELECT pi.alternate_part_number_id, pe.position_id, p.aircraft_type_id FROM position_eligibility pe JOIN positions p ON p.id = pe.position_id JOIN part_interchange pi ON pi.part_number_id = pe.part_number_id WHERE pi.alternate_part_number_id IN (?)
     UNION SELECT pi.part_number_id, pe.position_id, p.aircraft_type_id FROM position_eligibility pe JOIN positions p ON p.id = pe.position_id JOIN part_interchange pi ON pi.alternate_part_number_id = pe.part_number_id AND pi.two_way = 1 WHERE pi.part_number_id IN (?)`,
    [pnId, pnId, pnId],
  );
  const seqs = entries.map((e) => e.seq);
  const inspectors = seqs.length
    ? await rows(pool, `SELECT s.removed_seq, s.installed_seq, u.name, u.licence_number FROM swaps s JOIN users u ON u.id = s.inspected_by WHERE s.removed_seq IN (${inList(seqs)}) OR s.installed_seq IN (${inList(seqs)})`, [...seqs, ...seqs])
    : [];
  return { part: part[0], entries, findings: [], facts: { positions: positions.length, aircraft: aircraft.length, eligibility: eligibility.length, inspectors: inspectors.length } };
}

/** GET /api/aircraft/{registration}: the aircraft, every position with what is fitted, eligibility, and the fitted units' findings counts. */
async function aircraftMap(pool: mysql.Pool, sessionId: string, registration: string) {
  await sessionUser(pool, sessionId);
  const [aircraft] = await rows(
    pool,
    `SELECT a.id, a.registration, a.manufacturer_serial_number, a.aircraft_type_id, t.code AS type_code, t.name AS type_name, s.code AS station_code, s.name AS station_name, s.time_zone,
            lu.total_minutes, lu.total_cycles, lu.as_of
       FROM aircraft a JOIN aircraft_types t ON t.id = a.aircraft_type_id JOIN stations s ON s.id = a.station_id
       LEFT JOIN utilization lu ON lu.id = (SELECT u.id FROM utilization u WHERE u.aircraft_id = a.id ORDER BY u.as_of DESC LIMIT 1)
      WHERE a.registration = ? LIMIT 1`,
    [registration],
  );
  const [positions, eligibility] = await Promise.all([
    rows(
      pool,
      `SELECT p.id, p.code, p.label, p.parent_code, p.ata_chapter, p.zone, p.map_x, p.map_y, p.cautions, p.requires_independent_inspection,
              f.part_id, f.installed_at, f.aircraft_minutes_at_install, f.aircraft_cycles_at_install, f.tsn_minutes_at_install, f.csn_at_install, f.tso_minutes_at_install, f.cso_at_install,
              pt.serial_number, pt.manufactured_on, pn.part_number, pn.cage, pn.description, pn.life_limit_minutes, pn.life_limit_cycles, pn.life_limit_days
         FROM positions p LEFT JOIN fitted f ON f.position_id = p.id AND f.aircraft_id = ? LEFT JOIN parts pt ON pt.id = f.part_id LEFT JOIN part_numbers pn ON pn.id = pt.part_number_id
        WHERE p.aircraft_type_id = ? ORDER BY p.sort_order`,
      [aircraft.id, aircraft.aircraft_type_id],
    ),
    rows(pool, "SELECT pe.position_id, pn.part_number FROM position_eligibility pe JOIN positions p ON p.id = pe.position_id JOIN part_numbers pn ON pn.id = pe.part_number_id WHERE p.aircraft_type_id = ? ORDER BY pn.part_number", [aircraft.aircraft_type_id]),
  ]);
  const partIds = positions.filter((p) => p.part_id !== null).map((p) => p.part_id);
  const findings = await findingCounts(pool, partIds);
  const eligibleAt = new Map<unknown, unknown[]>();
  for (const e of eligibility) eligibleAt.set(e.position_id, [...(eligibleAt.get(e.position_id) ?? []), e.part_number]);
  return { aircraft, positions: positions.map((p) => ({ ...p, eligible: eligibleAt.get(p.id) ?? [], findings: findings.get(Number(p.part_id)) ?? 0 })) };
}

/** The cached findings counts of the given units, as the app reads them when none is stale. */
async function findingCounts(pool: mysql.Pool, partIds: unknown[]): Promise<Map<number, number>> {
  if (!partIds.length) return new Map();
  await rows(pool, "SELECT revision FROM catalog_revision WHERE id = 1");
  const cached = await rows(
    pool,
    `SELECT p.id, (SELECT MAX(e.seq) FROM ledger_entries e WHERE e.part_id = p.id) AS last_seq, tf.finding_count, tf.through_seq, tf.catalog_revision
       FROM parts p LEFT JOIN thread_findings tf ON tf.part_id = p.id WHERE p.id IN (${inList(partIds)})`,
    partIds,
  );
  return new Map(cached.map((row) => [Number(row.id), Number(row.finding_count ?? 0)]));
}

export interface BaselineSwap {
  registration: string;
  positionCode: string;
  onPartId: number;
  minutes: number;
  cycles: number;
  idempotencyKey: string;
}

const RETRYABLE = new Set(["ER_LOCK_DEADLOCK", "ER_LOCK_WAIT_TIMEOUT"]);

/** POST /api/swaps: the app's transaction statement for statement, with the checks reduced to what the SQL returns. */
async function swap(pool: mysql.Pool, sessionId: string, input: BaselineSwap) {
  const user = await sessionUser(pool, sessionId);
  await rows(pool, "SELECT request_hash, response FROM swaps WHERE idempotency_key = ? LIMIT 1", [input.idempotencyKey]);
  // Deadlocks between concurrent swaps are retried, as the app retries them.
  for (let attempt = 1; ; attempt++) {
    try {
      return await swapTransaction(pool, user, input);
    } catch (error) {
      if (!RETRYABLE.has(String((error as { code?: string }).code)) || attempt >= 4) throw error;
    }
  }
}

async function swapTransaction(pool: mysql.Pool, user: Row, input: BaselineSwap) {
  const conn = await pool.getConnection();
  try {
    await conn.query("BEGIN");
    const [aircraft] = await rows(conn, "SELECT id, registration, aircraft_type_id FROM aircraft WHERE registration = ? LIMIT 1 FOR UPDATE", [input.registration]);
    // The position, its fitted unit and the latest snapshot in one read, as src/server/swap-checks.ts reads them.
    const latest = (column: string) => `(select \`${column}\` from \`utilization\` where \`aircraft_id\` = ? order by \`as_of\` desc limit ?)`;
    const [position] = await rows(
      conn,
      `SELECT p.id, p.code, p.label, p.requires_independent_inspection, p.ata_chapter, f.part_id, f.installed_seq, f.aircraft_minutes_at_install, f.aircraft_cycles_at_install,
              f.tsn_minutes_at_install, f.csn_at_install, f.tso_minutes_at_install, f.cso_at_install, pt.serial_number, pn.part_number, pn.cage,
              ${latest("as_of")} AS latest_as_of, ${latest("total_minutes")} AS latest_minutes, ${latest("total_cycles")} AS latest_cycles
         FROM positions p LEFT JOIN fitted f ON f.position_id = p.id AND f.aircraft_id = ? LEFT JOIN parts pt ON pt.id = f.part_id LEFT JOIN part_numbers pn ON pn.id = pt.part_number_id
        WHERE p.aircraft_type_id = ? AND p.code = ? LIMIT 1`,
      [aircraft.id, 1, aircraft.id, 1, aircraft.id, 1, aircraft.id, aircraft.aircraft_type_id, input.positionCode],
    );
    const fitted = position;
    const [on] = await rows(
      conn,
      "SELECT pt.*, pn.part_number, pn.cage, pn.life_limit_minutes, pn.life_limit_cycles, pn.life_limit_days, pn.id AS pn_id FROM parts pt JOIN part_numbers pn ON pn.id = pt.part_number_id WHERE pt.id = ? AND pt.status = 'serviceable' FOR UPDATE",
      [input.onPartId],
    );
    // Eligibility, where else the unit is fitted and its latest release in one read.
    const [certificate] = await rows(
      conn,
      `SELECT EXISTS (SELECT pe.part_number_id FROM position_eligibility pe WHERE pe.position_id = ? AND (pe.part_number_id = ?
                OR EXISTS (SELECT * FROM part_interchange pi WHERE pi.part_number_id = pe.part_number_id AND pi.alternate_part_number_id = ?)
                OR EXISTS (SELECT * FROM part_interchange pi WHERE pi.alternate_part_number_id = pe.part_number_id AND pi.part_number_id = ? AND pi.two_way = ?))) AS eligible,
              (SELECT a.registration FROM fitted f JOIN aircraft a ON a.id = f.aircraft_id JOIN positions p ON p.id = f.position_id WHERE f.part_id = ? LIMIT ?) AS fitted_registration,
              (SELECT p.code FROM fitted f JOIN aircraft a ON a.id = f.aircraft_id JOIN positions p ON p.id = f.position_id WHERE f.part_id = ? LIMIT ?) AS fitted_code,
              (SELECT document_id FROM ledger_entries WHERE part_id = ? AND kind IN ('received', 'repaired') ORDER BY seq DESC LIMIT ?) AS document_id
        LIMIT 1`,
      [position.id, on.pn_id, on.pn_id, on.pn_id, true, on.id, 1, on.id, 1, on.id, 1],
    );
    await rows(conn, "SELECT request_hash, response FROM swaps WHERE idempotency_key = ? LIMIT 1", [input.idempotencyKey]);

    const now = new Date();
    const flown = input.minutes - Number(fitted.aircraft_minutes_at_install);
    const flownCycles = input.cycles - Number(fitted.aircraft_cycles_at_install);
    const offTotals = { tsn: Number(fitted.tsn_minutes_at_install) + flown, csn: Number(fitted.csn_at_install) + flownCycles };
    await rows(
      conn,
      `UPDATE parts SET status = IF(id = ?, 'unserviceable', 'installed'), bin = NULL,
              tsn_minutes = IF(id = ?, ?, tsn_minutes), csn = IF(id = ?, ?, csn), tso_minutes = IF(id = ?, ?, tso_minutes), cso = IF(id = ?, ?, cso), updated_at = ?
        WHERE id IN (?, ?)`,
      [fitted.part_id, fitted.part_id, offTotals.tsn, fitted.part_id, offTotals.csn, fitted.part_id, null, fitted.part_id, null, now, fitted.part_id, on.id],
    );
    await rows(conn, "INSERT INTO utilization (aircraft_id, as_of, recorded_at, recorded_by, total_cycles, total_minutes) VALUES (?, ?, ?, ?, ?, ?)", [aircraft.id, now, now, user.id, input.cycles, input.minutes]);

    const [head] = await rows(conn, "SELECT last_seq, last_hash FROM ledger_head WHERE id = 1 LIMIT 1 FOR UPDATE");
    const at = now.toISOString();
    const common = { aircraftId: Number(aircraft.id), positionId: Number(position.id), occurredAt: at, recordedAt: at, recordedBy: String(user.id), aircraftMinutes: input.minutes, aircraftCycles: input.cycles, tsoMinutes: null, cso: null, workOrder: "WO-BENCH", taskReference: "bench", correctsSeq: null, details: null };
    const removed = chainEntry(String(head.last_hash), { ...common, seq: Number(head.last_seq) + 1, kind: "removed", partId: Number(fitted.part_id), tsnMinutes: offTotals.tsn, csn: offTotals.csn, removalType: "scheduled", reason: "Planned rotation (bench)", testResult: null, documentId: null });
    const installed = chainEntry(removed.hash, { ...common, seq: removed.seq + 1, kind: "installed", partId: Number(on.id), tsnMinutes: Number(on.tsn_minutes), csn: Number(on.csn), removalType: null, reason: null, testResult: "Operational test: passed", documentId: certificate?.document_id === undefined ? null : Number(certificate.document_id) });
    const entryRows = [removed, installed].map(entryToRow);
    const columns = Object.keys(entryRows[0]);
    const placeholders = `(${columns.map(() => "?").join(",")})`;
    await rows(conn, `INSERT INTO ledger_entries (${columns.join(",")}) VALUES ${placeholders}, ${placeholders}`, entryRows.flatMap((r) => Object.values(r)));
    await rows(conn, "UPDATE ledger_head SET last_seq = ?, last_hash = ? WHERE id = 1", [installed.seq, installed.hash]);
    await rows(
      conn,
      `UPDATE fitted SET part_id = ?, installed_seq = ?, installed_at = ?, aircraft_minutes_at_install = ?, aircraft_cycles_at_install = ?,
              tsn_minutes_at_install = ?, csn_at_install = ?, tso_minutes_at_install = ?, cso_at_install = ?
        WHERE aircraft_id = ? AND position_id = ?`,
      [on.id, installed.seq, now, input.minutes, input.cycles, on.tsn_minutes, on.csn, null, null, aircraft.id, position.id],
    );
    const body = { swap: { id: randomUUID(), registration: input.registration, positionCode: input.positionCode }, entries: [removed, installed] };
    await rows(
      conn,
      "INSERT INTO swaps (aircraft_id, created_at, id, idempotency_key, inspected_at, inspected_by, installed_seq, performed_at, performed_by, position_id, removed_seq, request_hash, response) VALUES (?, ?, ?, ?, NULL, NULL, ?, ?, ?, ?, ?, ?, ?)",
      [aircraft.id, now, body.swap.id, input.idempotencyKey, installed.seq, now, user.id, position.id, removed.seq, "bench", JSON.stringify(body)],
    );
    await conn.query("COMMIT");
    return body;
  } catch (error) {
    await conn.query("ROLLBACK");
    throw error;
  } finally {
    conn.release();
  }
}

const sessionOf = (req: http.IncomingMessage) => /threadline_session=([^;]+)/.exec(req.headers.cookie ?? "")?.[1] ?? "";

export function baselineServer(pool: mysql.Pool): http.Server {
  return http.createServer(async (req, res) => {
    try {
      const url = new URL(req.url ?? "/", "http://baseline");
      const partTrace = url.pathname.match(/^\/api\/parts\/(\d+)\/trace$/);
      const aircraft = url.pathname.match(/^\/api\/aircraft\/([^/]+)$/);
      let body: unknown;
      if (partTrace) body = await trace(pool, sessionOf(req), Number(partTrace[1]));
      else if (aircraft) body = await aircraftMap(pool, sessionOf(req), decodeURIComponent(aircraft[1]));
      else if (url.pathname === "/api/swaps" && req.method === "POST") {
        const chunks: Buffer[] = [];
        for await (const chunk of req) chunks.push(chunk as Buffer);
        body = await swap(pool, sessionOf(req), JSON.parse(Buffer.concat(chunks).toString()) as BaselineSwap);
      } else {
        // The app's answer to an address no route serves, for the framework-floor comparison.
        res.writeHead(404, { "content-type": "application/json" }).end(JSON.stringify({ error: { code: "no_such_route", message: `There is no API route ${req.method} ${url.pathname}.` } }));
        return;
      }
      res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(body));
    } catch (error) {
      res.writeHead(500).end(String(error));
    }
  });
}
