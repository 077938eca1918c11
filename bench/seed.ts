// `npm run bench:seed`: an invented fleet at scale in bench/.data (its own MariaDB data directory and
// database): 200 aircraft, 500 positions per type, 2,000 part numbers, 100,000 serialised units and
// 1,000,000 hash-chained ledger entries, with fitted, parts and utilization consistent with the ledger.
// Bulk rows go in with LOAD DATA LOCAL INFILE, streamed from the generator, checks off (see
// /work/shared/design/performance.md, point 6).
import { Readable } from "node:stream";
import { rmSync } from "node:fs";
import mysql from "mysql2/promise";
import { chainEntry, GENESIS_HASH } from "../src/domain/ledger-hash";
import type { LedgerEntryFields } from "../src/domain/ledger-types";
import { entryToRow } from "../src/lib/ledger-rows";
import { ensureAppDatabase, startMariadb } from "../scripts/lib/mariadb";
import { APP_DB_PASSWORD, APP_DB_USER, appKnex } from "../scripts/lib/services";
import { BENCH, BENCH_CAGE, BENCH_DB_ARGS, partNumberOf, positionCodeOf, registrationOf } from "./fleet-shape";

const log = (message: string) => process.stdout.write(`[bench:seed] ${message}\n`);
const DAY = 86_400_000;
const START = Date.parse("2024-01-01T00:00:00.000Z");
const SLOTS = BENCH.aircraft * BENCH.positionsPerType;

// Time line: receipts on day 0, round j installs on day 60j and removals 30 days later, final installs on day 330.
const installDay = (round: number) => 60 * round;
const removalDay = (round: number) => 60 * round + 30;
const FINAL_DAY = 330;
const aircraftMinutes = (aircraftId: number, day: number) => 600_000 + aircraftId * 1_000 + day * 480;
const aircraftCycles = (aircraftId: number, day: number) => 8_000 + aircraftId * 10 + day * 5;
const at = (day: number, slot: number) => new Date(START + day * DAY + (slot % 36_000) * 1_000).toISOString();

/** Units by slot: unit p sits (now, or last) at slot p-1; in round j it flew on the aircraft 2j further on (same type). */
const slotOf = (partId: number) => partId - 1;
const aircraftOfSlot = (slot: number) => Math.floor(slot / BENCH.positionsPerType) + 1;
const indexOfSlot = (slot: number) => slot % BENCH.positionsPerType;
const typeOfAircraft = (aircraftId: number) => ((aircraftId - 1) % BENCH.types) + 1;
const positionIdOf = (typeId: number, index: number) => (typeId - 1) * BENCH.positionsPerType + index + 1;
const partNumberIdOf = (typeId: number, index: number) => ((typeId - 1) * BENCH.positionsPerType + index) % BENCH.partNumbers + 1;
const roundAircraft = (aircraftId: number, round: number) => ((aircraftId - 1 + 2 * round) % BENCH.aircraft) + 1;
const isFittedNow = (partId: number) => slotOf(partId) % 10 < BENCH.fittedTenths;
const FLOWN_PER_ROUND = { minutes: 30 * 480, cycles: 30 * 5 };

const fmt = (value: unknown): string => {
  if (value === null || value === undefined) return "\\N";
  if (value instanceof Date) return value.toISOString().replace("T", " ").replace("Z", "");
  return String(value).replace(/\\/g, "\\\\").replace(/\t/g, "\\t").replace(/\n/g, "\\n");
};

function* rowsToTsv(rows: Iterable<unknown[]>, batch = 2_000): Generator<Buffer> {
  let chunk: string[] = [];
  for (const row of rows) {
    chunk.push(row.map(fmt).join("\t"));
    if (chunk.length >= batch) {
      yield Buffer.from(chunk.join("\n") + "\n");
      chunk = [];
    }
  }
  if (chunk.length) yield Buffer.from(chunk.join("\n") + "\n");
}

async function load(connection: mysql.Connection, table: string, columns: string[], rows: Iterable<unknown[]>) {
  const started = Date.now();
  const [result] = await connection.query({
    sql: `LOAD DATA LOCAL INFILE 'generated' INTO TABLE \`${table}\` CHARACTER SET utf8mb4 FIELDS TERMINATED BY '\\t' ESCAPED BY '\\\\' LINES TERMINATED BY '\\n' (${columns.map((c) => `\`${c}\``).join(", ")})`,
    infileStreamFactory: () => Readable.from(rowsToTsv(rows), { objectMode: false }),
  });
  log(`${table}: ${(result as mysql.ResultSetHeader).affectedRows} rows in ${((Date.now() - started) / 1000).toFixed(1)} s`);
}

interface PartState {
  tsn: number;
  csn: number;
}

/** Every ledger entry in seq order, chained; the final state of each unit is collected on the way. */
function* ledger(finalParts: PartState[], fittedRows: unknown[][], head: { seq: number; hash: string }): Generator<unknown[]> {
  let prevHash = GENESIS_HASH;
  let seq = 0;
  const emit = (fields: Omit<LedgerEntryFields, "seq">) => {
    seq += 1;
    const chained = chainEntry(prevHash, { ...fields, seq });
    prevHash = chained.hash;
    const row = entryToRow(chained);
    return [row.seq, row.kind, row.part_id, row.aircraft_id, row.position_id, row.occurred_at, row.recorded_at, row.recorded_by, row.aircraft_minutes, row.aircraft_cycles, row.tsn_minutes, row.csn, row.tso_minutes, row.cso, row.removal_type, row.reason, row.work_order, row.task_reference, row.test_result, row.document_id, row.corrects_seq, row.details, row.prev_hash, row.hash];
  };
  const blank = { tsoMinutes: null, cso: null, removalType: null, reason: null, workOrder: null, taskReference: null, testResult: null, documentId: null, correctsSeq: null, details: null } as const;
  const state: PartState[] = Array.from({ length: BENCH.parts + 1 }, () => ({ tsn: 0, csn: 0 }));

  for (let partId = 1; partId <= BENCH.parts; partId++) {
    const when = at(0, partId);
    yield emit({ ...blank, kind: "received", partId, aircraftId: null, positionId: null, occurredAt: when, recordedAt: when, recordedBy: "usr-stores", aircraftMinutes: null, aircraftCycles: null, tsnMinutes: 0, csn: 0, details: { bin: `B-${partId % 400}` } });
  }
  for (let round = 1; round <= BENCH.rounds; round++) {
    for (const [kind, day] of [["installed", installDay(round)], ["removed", removalDay(round)]] as const) {
      for (let partId = 1; partId <= BENCH.parts; partId++) {
        const slot = slotOf(partId);
        const aircraftId = roundAircraft(aircraftOfSlot(slot), round);
        const positionId = positionIdOf(typeOfAircraft(aircraftId), indexOfSlot(slot));
        const unit = state[partId];
        if (kind === "removed") {
          unit.tsn += FLOWN_PER_ROUND.minutes;
          unit.csn += FLOWN_PER_ROUND.cycles;
        }
        const when = at(day, slot);
        const unscheduled = kind === "removed" && partId % 3 === 0;
        yield emit({
          ...blank,
          kind,
          partId,
          aircraftId,
          positionId,
          occurredAt: when,
          recordedAt: when,
          recordedBy: "usr-technician",
          aircraftMinutes: aircraftMinutes(aircraftId, day),
          aircraftCycles: aircraftCycles(aircraftId, day),
          tsnMinutes: unit.tsn,
          csn: unit.csn,
          removalType: kind === "removed" ? (unscheduled ? "unscheduled" : "scheduled") : null,
          reason: kind === "removed" ? (unscheduled ? "Fault reported by the crew; confirmed on the ground" : "Planned rotation") : null,
          workOrder: `WO-${round}-${partId}`,
          taskReference: "Maintenance manual task (bench data)",
          testResult: kind === "installed" ? "Operational test: passed" : null,
        });
      }
    }
  }
  for (let partId = 1; partId <= BENCH.parts; partId++) {
    const slot = slotOf(partId);
    const unit = state[partId];
    const when = at(FINAL_DAY, slot);
    if (isFittedNow(partId)) {
      const aircraftId = aircraftOfSlot(slot);
      const positionId = positionIdOf(typeOfAircraft(aircraftId), indexOfSlot(slot));
      const minutes = aircraftMinutes(aircraftId, FINAL_DAY);
      const cycles = aircraftCycles(aircraftId, FINAL_DAY);
      yield emit({ ...blank, kind: "installed", partId, aircraftId, positionId, occurredAt: when, recordedAt: when, recordedBy: "usr-technician", aircraftMinutes: minutes, aircraftCycles: cycles, tsnMinutes: unit.tsn, csn: unit.csn, workOrder: `WO-F-${partId}`, taskReference: "Maintenance manual task (bench data)", testResult: "Operational test: passed" });
      fittedRows.push([aircraftId, positionId, partId, seq, new Date(when), minutes, cycles, unit.tsn, unit.csn, null, null]);
    } else {
      yield emit({ ...blank, kind: "repaired", partId, aircraftId: null, positionId: null, occurredAt: when, recordedAt: when, recordedBy: "usr-stores", aircraftMinutes: null, aircraftCycles: null, tsnMinutes: unit.tsn, csn: unit.csn, details: { shop: "Bench shop" } });
    }
    finalParts[partId] = unit;
  }
  head.seq = seq;
  head.hash = prevHash;
}

async function main() {
  const started = Date.now();
  if (process.argv.includes("--fresh")) rmSync(BENCH.dataDir, { recursive: true, force: true });
  const server = await startMariadb({ dataDir: BENCH.dataDir, port: BENCH.dbPort, extraArgs: BENCH_DB_ARGS, log });
  try {
    const { rootSql } = await import("../scripts/lib/mariadb");
    await rootSql(server.socket, `DROP DATABASE IF EXISTS \`${BENCH.database}\``);
    await ensureAppDatabase(server.socket, { database: BENCH.database, user: APP_DB_USER, password: APP_DB_PASSWORD });
    const env = { DB_HOST: "127.0.0.1", DB_PORT: String(BENCH.dbPort), DB_NAME: BENCH.database, DB_USER: APP_DB_USER, DB_PASSWORD: APP_DB_PASSWORD };
    const knex = appKnex(env);
    try {
      await knex.migrate.latest();
      // Stations and the demo users only (they sign the entries); the fleet below replaces the demo fleet.
      await knex.seed.run({ specific: "01_stations-and-users.ts" });
    } finally {
      await knex.destroy();
    }
    log("schema and users ready");

    const connection = await mysql.createConnection({ host: "127.0.0.1", port: BENCH.dbPort, user: APP_DB_USER, password: APP_DB_PASSWORD, database: BENCH.database, timezone: "Z" });
    try {
      await connection.query("SET foreign_key_checks = 0, unique_checks = 0, sql_log_bin = 0").catch(() => connection.query("SET foreign_key_checks = 0, unique_checks = 0"));
      await load(connection, "aircraft_types", ["id", "code", "name"], Array.from({ length: BENCH.types }, (_, i) => [i + 1, `BT${i + 1}`, `Bench type ${i + 1}`]));
      await load(
        connection,
        "part_numbers",
        ["id", "part_number", "cage", "description", "ata_chapter", "serialised", "life_limit_minutes", "life_limit_cycles"],
        Array.from({ length: BENCH.partNumbers }, (_, i) => [i + 1, partNumberOf(i + 1), BENCH_CAGE, `Bench component ${i + 1}`, `${21 + (i % 30)}-${String(10 + (i % 80)).padStart(2, "0")}`, 1, null, null]),
      );
      const positions: unknown[][] = [];
      const eligibility: unknown[][] = [];
      for (let typeId = 1; typeId <= BENCH.types; typeId++) {
        for (let index = 0; index < BENCH.positionsPerType; index++) {
          const id = positionIdOf(typeId, index);
          positions.push([id, typeId, positionCodeOf(index), `Bench position ${index + 1}`, `${21 + (index % 30)}-10`, (index * 2) % 1000, (index * 7) % 600, `Z${index % 8}`, 0, index]);
          eligibility.push([id, partNumberIdOf(typeId, index)]);
        }
      }
      await load(connection, "positions", ["id", "aircraft_type_id", "code", "label", "ata_chapter", "map_x", "map_y", "zone", "requires_independent_inspection", "sort_order"], positions);
      await load(connection, "position_eligibility", ["position_id", "part_number_id"], eligibility);
      await load(connection, "aircraft", ["id", "registration", "manufacturer_serial_number", "aircraft_type_id", "station_id"], Array.from({ length: BENCH.aircraft }, (_, i) => [i + 1, registrationOf(i + 1), `B-${1000 + i}`, typeOfAircraft(i + 1), (i % 2) + 1]));

      const utilization: unknown[][] = [];
      const days = [0, ...Array.from({ length: BENCH.rounds }, (_, r) => [installDay(r + 1), removalDay(r + 1)]).flat(), FINAL_DAY];
      for (let aircraftId = 1; aircraftId <= BENCH.aircraft; aircraftId++) {
        for (const day of days) utilization.push([aircraftId, new Date(START + day * DAY + 36_000_000), aircraftMinutes(aircraftId, day + 1), aircraftCycles(aircraftId, day + 1), "usr-technician", new Date(START + day * DAY + 36_000_000)]);
      }
      await load(connection, "utilization", ["aircraft_id", "as_of", "total_minutes", "total_cycles", "recorded_by", "recorded_at"], utilization);

      const finalParts: PartState[] = [];
      const fittedRows: unknown[][] = [];
      const head = { seq: 0, hash: GENESIS_HASH };
      await load(
        connection,
        "ledger_entries",
        ["seq", "kind", "part_id", "aircraft_id", "position_id", "occurred_at", "recorded_at", "recorded_by", "aircraft_minutes", "aircraft_cycles", "tsn_minutes", "csn", "tso_minutes", "cso", "removal_type", "reason", "work_order", "task_reference", "test_result", "document_id", "corrects_seq", "details", "prev_hash", "hash"],
        ledger(finalParts, fittedRows, head),
      );
      const updatedAt = new Date(START + FINAL_DAY * DAY + DAY);
      await load(
        connection,
        "parts",
        ["id", "part_number_id", "serial_number", "status", "bin", "tsn_minutes", "csn", "updated_at"],
        (function* () {
          for (let partId = 1; partId <= BENCH.parts; partId++) {
            const slot = slotOf(partId);
            const fitted = isFittedNow(partId);
            yield [partId, partNumberIdOf(typeOfAircraft(aircraftOfSlot(slot)), indexOfSlot(slot)), `BS${String(partId).padStart(7, "0")}`, fitted ? "installed" : "serviceable", fitted ? null : `B-${partId % 400}`, finalParts[partId].tsn, finalParts[partId].csn, updatedAt];
          }
        })(),
      );
      await load(connection, "fitted", ["aircraft_id", "position_id", "part_id", "installed_seq", "installed_at", "aircraft_minutes_at_install", "aircraft_cycles_at_install", "tsn_minutes_at_install", "csn_at_install", "tso_minutes_at_install", "cso_at_install"], fittedRows);
      await connection.query("UPDATE ledger_head SET last_seq = ?, last_hash = ? WHERE id = 1", [head.seq, head.hash]);
      await connection.query("SET foreign_key_checks = 1, unique_checks = 1");
      await connection.query("ANALYZE TABLE ledger_entries, parts, fitted, utilization, positions");
      log(`ledger head at seq ${head.seq}`);
    } finally {
      await connection.end();
    }
    log(`done in ${((Date.now() - started) / 1000).toFixed(0)} s; data in ${BENCH.dataDir}`);
  } finally {
    await server.stop();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
