// `npm run bench`: the built app (`next start`) and a bare node:http + mysql2 baseline answering the
// same SQL, both against the fleet-scale database from `npm run bench:seed`. Bounded request loops on
// loopback, no timed assertions; prints one table and writes bench/results.json.
import { spawn, type ChildProcess } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, writeFileSync } from "node:fs";
import http from "node:http";
import path from "node:path";
import { gzipSync } from "node:zlib";
import mysql from "mysql2/promise";
import { chainEntry } from "../src/domain/ledger-hash";
import { entryToRow } from "../src/lib/ledger-rows";
import { ensureBuild } from "../scripts/lib/build";
import { freePort, startMailFake, startS3Fake, stopChild, waitForPort } from "../scripts/lib/fakes";
import { startMariadb } from "../scripts/lib/mariadb";
import { APP_DB_PASSWORD, APP_DB_USER, projectRoot, S3_BUCKET } from "../scripts/lib/services";
import { BENCH, BENCH_CAGE, BENCH_DB_ARGS, partNumberOf, positionCodeOf, registrationOf } from "./fleet-shape";

const log = (message: string) => process.stdout.write(`[bench] ${message}\n`);
const SERIAL_SWAPS = 100;
const CONCURRENT_SWAPS = 200;
const CLIENTS = 8;
const READS = 300;

interface Figure {
  name: string;
  unit: string;
  threadline: number | null;
  baseline: number | null;
  ratio: number | null;
  goal: string;
  met: boolean | null;
  note?: string;
}

const p50 = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
async function timeEach(count: number, once: (i: number) => Promise<void>): Promise<number[]> {
  const times: number[] = [];
  for (let i = 0; i < count; i++) {
    const started = performance.now();
    await once(i);
    times.push(performance.now() - started);
  }
  return times;
}
async function throughput(count: number, clients: number, once: (i: number) => Promise<void>): Promise<number> {
  let next = 0;
  const started = performance.now();
  await Promise.all(Array.from({ length: clients }, async () => { while (next < count) await once(next++); }));
  return count / ((performance.now() - started) / 1000);
}
function figure(name: string, unit: string, threadline: number | null, baseline: number | null, goal: string, higherIsBetter = false, note?: string): Figure {
  const ratio = threadline !== null && baseline !== null ? (higherIsBetter ? baseline / threadline : threadline / baseline) : null;
  const limit = Number(goal.replace(/[^0-9.]/g, ""));
  return { name, unit, threadline, baseline, ratio: ratio === null ? null : Math.round(ratio * 100) / 100, goal, met: ratio === null ? null : ratio <= limit, ...(note ? { note } : {}) };
}

// The shapes of SQL the app's routes run, issued straight through mysql2 for the baseline.
const PART_SQL = "SELECT pt.*, pn.part_number, pn.cage, pn.description FROM parts pt JOIN part_numbers pn ON pn.id = pt.part_number_id WHERE pt.id = ?";
const PART_ENTRIES_SQL = "SELECT * FROM ledger_entries WHERE part_id = ? ORDER BY seq";
const AIRCRAFT_SQL = "SELECT a.*, t.code AS type_code FROM aircraft a JOIN aircraft_types t ON t.id = a.aircraft_type_id WHERE a.registration = ?";
const POSITIONS_SQL =
  "SELECT p.code, p.label, p.ata_chapter, f.installed_at, f.aircraft_minutes_at_install, f.tsn_minutes_at_install, pt.serial_number, pt.tsn_minutes, pt.csn, pn.part_number, pn.cage FROM positions p LEFT JOIN fitted f ON f.position_id = p.id AND f.aircraft_id = ? LEFT JOIN parts pt ON pt.id = f.part_id LEFT JOIN part_numbers pn ON pn.id = pt.part_number_id WHERE p.aircraft_type_id = ? ORDER BY p.sort_order";

function baselineServer(pool: mysql.Pool): http.Server {
  return http.createServer(async (req, res) => {
    try {
      const url = new URL(req.url ?? "/", "http://x");
      let body: unknown;
      const part = url.pathname.match(/^\/parts\/(\d+)$/);
      const aircraft = url.pathname.match(/^\/aircraft\/([^/]+)$/);
      if (part) {
        const [[row]] = (await pool.execute(PART_SQL, [part[1]])) as unknown as [Record<string, unknown>[]];
        const [entries] = await pool.execute(PART_ENTRIES_SQL, [part[1]]);
        body = { part: row, entries };
      } else if (aircraft) {
        const [[a]] = (await pool.execute(AIRCRAFT_SQL, [decodeURIComponent(aircraft[1])])) as unknown as [Record<string, unknown>[]];
        const [positions] = await pool.execute(POSITIONS_SQL, [a.id, a.aircraft_type_id] as never[]);
        body = { aircraft: a, positions };
      } else if (url.pathname === "/swaps" && req.method === "POST") {
        const chunks: Buffer[] = [];
        for await (const chunk of req) chunks.push(chunk as Buffer);
        body = await baselineSwap(pool, JSON.parse(Buffer.concat(chunks).toString()));
      } else {
        res.writeHead(404).end();
        return;
      }
      res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(body));
    } catch (error) {
      res.writeHead(500).end(String(error));
    }
  });
}

/** The swap transaction at its barest: lock, check, two chained entries, three updates, commit. */
async function baselineSwap(pool: mysql.Pool, input: { aircraftId: number; positionId: number; onPartId: number; minutes: number; cycles: number }) {
  const connection = await pool.getConnection();
  try {
    await connection.beginTransaction();
    await connection.execute("SELECT id FROM aircraft WHERE id = ? FOR UPDATE", [input.aircraftId]);
    const [[fitted]] = (await connection.execute("SELECT * FROM fitted WHERE aircraft_id = ? AND position_id = ? FOR UPDATE", [input.aircraftId, input.positionId])) as unknown as [Record<string, number>[]];
    const [[off]] = (await connection.execute("SELECT * FROM parts WHERE id = ? FOR UPDATE", [fitted.part_id])) as unknown as [Record<string, number>[]];
    const [[on]] = (await connection.execute("SELECT * FROM parts WHERE id = ? AND status = 'serviceable' FOR UPDATE", [input.onPartId])) as unknown as [Record<string, number>[]];
    const [[head]] = (await connection.execute("SELECT last_seq, last_hash FROM ledger_head WHERE id = 1 FOR UPDATE")) as unknown as [Array<{ last_seq: number; last_hash: string }>];
    const now = new Date().toISOString();
    const flown = input.minutes - Number(fitted.aircraft_minutes_at_install);
    const base = { aircraftId: input.aircraftId, positionId: input.positionId, occurredAt: now, recordedAt: now, recordedBy: "usr-technician", aircraftMinutes: input.minutes, aircraftCycles: input.cycles, tsoMinutes: null, cso: null, reason: null, workOrder: "WO-BASE", taskReference: "bench", testResult: null, documentId: null, correctsSeq: null, details: null };
    const removed = chainEntry(head.last_hash, { ...base, seq: Number(head.last_seq) + 1, kind: "removed", partId: off.id, tsnMinutes: Number(off.tsn_minutes) + flown, csn: Number(off.csn), removalType: "scheduled" });
    const installed = chainEntry(removed.hash, { ...base, seq: removed.seq + 1, kind: "installed", partId: on.id, tsnMinutes: Number(on.tsn_minutes), csn: Number(on.csn), removalType: null });
    const rows = [removed, installed].map(entryToRow);
    const columns = Object.keys(rows[0]);
    await connection.execute(`INSERT INTO ledger_entries (${columns.join(",")}) VALUES (${columns.map(() => "?").join(",")}), (${columns.map(() => "?").join(",")})`, rows.flatMap((r) => Object.values(r)) as never[]);
    await connection.execute("UPDATE fitted SET part_id = ?, installed_seq = ?, installed_at = ?, aircraft_minutes_at_install = ?, aircraft_cycles_at_install = ?, tsn_minutes_at_install = ?, csn_at_install = ? WHERE aircraft_id = ? AND position_id = ?", [on.id, installed.seq, new Date(now), input.minutes, input.cycles, on.tsn_minutes, on.csn, input.aircraftId, input.positionId]);
    await connection.execute("UPDATE parts SET status = IF(id = ?, 'installed', 'unserviceable'), updated_at = ? WHERE id IN (?, ?)", [on.id, new Date(now), on.id, off.id]);
    await connection.execute("UPDATE ledger_head SET last_seq = ?, last_hash = ? WHERE id = 1", [installed.seq, installed.hash]);
    await connection.commit();
    return { entries: [removed.seq, installed.seq] };
  } catch (error) {
    await connection.rollback();
    throw error;
  } finally {
    connection.release();
  }
}

const tinyPdf = (text: string) => Buffer.from(`%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\n% ${text}\ntrailer << /Root 1 0 R >>\n%%EOF\n`);

async function main() {
  if (!existsSync(path.join(BENCH.dataDir, "mysql"))) throw new Error("no bench data: run `npm run bench:seed` first");
  ensureBuild(projectRoot, log);
  const stoppers: Array<() => Promise<void>> = [];
  const figures: Figure[] = [];
  try {
    const server = await startMariadb({ dataDir: BENCH.dataDir, port: BENCH.dbPort, extraArgs: BENCH_DB_ARGS, log });
    stoppers.push(() => server.stop());
    const s3Port = await freePort();
    const smtpPort = await freePort();
    const mailWebPort = await freePort();
    const s3 = await startS3Fake({ dir: path.join(BENCH.dataDir, "s3"), port: s3Port, bucket: S3_BUCKET, root: projectRoot });
    stoppers.push(() => s3.stop());
    const mail = await startMailFake({ dir: path.join(BENCH.dataDir, "mail"), smtpPort, webPort: mailWebPort, root: projectRoot });
    stoppers.push(() => mail.stop());
    const appPort = await freePort();
    const appUrl = `http://127.0.0.1:${appPort}`;
    const env = {
      DB_HOST: "127.0.0.1", DB_PORT: String(BENCH.dbPort), DB_NAME: BENCH.database, DB_USER: APP_DB_USER, DB_PASSWORD: APP_DB_PASSWORD, DB_ADMIN_SOCKET: server.socket,
      S3_ENDPOINT: `http://127.0.0.1:${s3Port}`, S3_BUCKET, S3_REGION: "us-east-1", S3_ACCESS_KEY_ID: "S3RVER", S3_SECRET_ACCESS_KEY: "S3RVER",
      SMTP_HOST: "127.0.0.1", SMTP_PORT: String(smtpPort), MAIL_FROM: "Threadline <no-reply@threadline.test>", MAIL_INBOX_URL: `http://127.0.0.1:${mailWebPort}`, APP_URL: appUrl,
    };
    const app: ChildProcess = spawn(path.join(projectRoot, "node_modules", ".bin", "next"), ["start", "-p", String(appPort), "-H", "127.0.0.1"], {
      cwd: projectRoot, stdio: ["ignore", "ignore", "inherit"], env: { ...process.env, ...env, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1" },
    });
    stoppers.push(() => stopChild(app));
    await waitForPort(appPort, 60_000);

    const pool = mysql.createPool({ host: "127.0.0.1", port: BENCH.dbPort, user: APP_DB_USER, password: APP_DB_PASSWORD, database: BENCH.database, timezone: "Z", connectionLimit: 8 });
    stoppers.push(() => pool.end());
    const baseline = baselineServer(pool);
    const basePort = await freePort();
    await new Promise<void>((resolve) => baseline.listen(basePort, "127.0.0.1", resolve));
    stoppers.push(() => new Promise((resolve) => baseline.close(() => resolve())));
    const baseUrl = `http://127.0.0.1:${basePort}`;
    log(`app on ${appUrl}, baseline on ${baseUrl}`);

    const signIn = async (role: string) => {
      const response = await fetch(`${appUrl}/api/session`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email: `${role}@demo.threadline.test`, password: "threadline-demo" }) });
      if (response.status !== 200) throw new Error(`sign-in as ${role}: ${response.status}`);
      return response.headers.getSetCookie().find((c) => c.startsWith("threadline_session="))!.split(";")[0];
    };
    const technician = await signIn("technician");
    const stores = await signIn("stores");
    const get = async (url: string, cookie?: string) => {
      const response = await fetch(url, { headers: cookie ? { cookie } : {} });
      const text = await response.text();
      if (response.status !== 200) throw new Error(`GET ${url}: ${response.status} ${text.slice(0, 200)}`);
      return text;
    };

    // Warm both sides up, then read one part (with its ledger entries) and one 500-position aircraft.
    const partIds = Array.from({ length: READS }, (_, i) => 1 + ((i * 7919) % BENCH.parts));
    for (const id of partIds.slice(0, 30)) await Promise.all([get(`${appUrl}/api/parts/${id}`, technician), get(`${baseUrl}/parts/${id}`)]);
    const traceExists = (await fetch(`${appUrl}/api/parts/1/trace`, { headers: { cookie: technician } })).status !== 404;
    const partPath = (id: number) => (traceExists ? `/api/parts/${id}/trace` : `/api/parts/${id}`);
    const appPart = p50(await timeEach(READS, (i) => get(`${appUrl}${partPath(partIds[i])}`, technician).then(() => {})));
    const basePart = p50(await timeEach(READS, (i) => get(`${baseUrl}/parts/${partIds[i]}`).then(() => {})));
    figures.push(figure(traceExists ? "GET /api/parts/{id}/trace p50" : "GET /api/parts/{id} p50 (trace route absent in this branch)", "ms", appPart, basePart, "<= 2"));

    const registrations = Array.from({ length: 100 }, (_, i) => registrationOf(1 + (i % BENCH.aircraft)));
    for (const r of registrations.slice(0, 10)) await Promise.all([get(`${appUrl}/api/aircraft/${r}`, technician), get(`${baseUrl}/aircraft/${r}`)]);
    const appAircraft = p50(await timeEach(registrations.length, (i) => get(`${appUrl}/api/aircraft/${registrations[i]}`, technician).then(() => {})));
    const baseAircraft = p50(await timeEach(registrations.length, (i) => get(`${baseUrl}/aircraft/${registrations[i]}`).then(() => {})));
    figures.push(figure("GET /api/aircraft/{registration} (500 positions) p50", "ms", appAircraft, baseAircraft, "<= 2"));

    // Swaps: each on its own fitted position, each installing a unit received through POST /api/receipts.
    const total = SERIAL_SWAPS + CONCURRENT_SWAPS;
    // Slots i*30 are fitted (slot modulo 10 below 7 is fitted); the baseline takes slots i*30+10.
    const slots = Array.from({ length: total }, (_, i) => i * 30);
    const plans: Array<{ registration: string; aircraftId: number; typeId: number; index: number; offSerial: string; partNumber: string; onSerial?: string }> = [];
    for (const slot of slots) {
      const aircraftId = Math.floor(slot / BENCH.positionsPerType) + 1;
      const index = slot % BENCH.positionsPerType;
      const typeId = ((aircraftId - 1) % BENCH.types) + 1;
      const pnId = (((typeId - 1) * BENCH.positionsPerType + index) % BENCH.partNumbers) + 1;
      plans.push({ registration: registrationOf(aircraftId), aircraftId, typeId, index, offSerial: `BS${String(slot + 1).padStart(7, "0")}`, partNumber: partNumberOf(pnId) });
    }
    log(`receiving ${plans.length} spares through POST /api/receipts`);
    const runTag = createHash("sha256").update(String(Date.now())).digest("hex").slice(0, 6).toUpperCase();
    await throughput(plans.length, 4, async (i) => {
      const serial = `BR${runTag}${i}`;
      const form = new FormData();
      const fields: Record<string, string> = { partNumber: plans[i].partNumber, cage: BENCH_CAGE, serialNumber: serial, quantity: "1", formType: "easa_form_1", statusWork: "new", trackingNumber: `TRK-${serial}`, issuerName: "Bench shop", issuerApproval: "QA.145.9999", issuedOn: new Date(Date.now() - 86_400_000).toISOString().slice(0, 10), tsn: "0:00", csn: "0", bin: "BENCH", certificateMatches: "true" };
      for (const [k, v] of Object.entries(fields)) form.append(k, v);
      form.append("certificate", new Blob([tinyPdf(serial)], { type: "application/pdf" }), "certificate.pdf");
      const response = await fetch(`${appUrl}/api/receipts`, { method: "POST", headers: { cookie: stores }, body: form });
      if (response.status !== 201) throw new Error(`receipt ${serial}: ${response.status} ${await response.text()}`);
      plans[i].onSerial = serial;
    });
    const [totals] = (await pool.query("SELECT aircraft_id, MAX(total_minutes) AS minutes, MAX(total_cycles) AS cycles FROM utilization GROUP BY aircraft_id")) as unknown as [Array<{ aircraft_id: number; minutes: number; cycles: number }>];
    const totalsOf = new Map(totals.map((t) => [t.aircraft_id, t]));
    const hm = (m: number) => `${Math.floor(m / 60)}:${String(m % 60).padStart(2, "0")}`;
    const appSwap = async (i: number) => {
      const plan = plans[i];
      const t = totalsOf.get(plan.aircraftId)!;
      const body = { registration: plan.registration, positionCode: positionCodeOf(plan.index), aircraftHours: hm(Number(t.minutes) + 60), aircraftCycles: Number(t.cycles) + 1, performedAt: new Date().toISOString(), removed: { partNumber: plan.partNumber, serialNumber: plan.offSerial }, installed: { partNumber: plan.partNumber, serialNumber: plan.onSerial }, removalType: "scheduled", reason: "Planned rotation (bench)", workOrder: "WO-BENCH", taskReference: "Maintenance manual task (bench)", testResult: "Operational test: passed" };
      const response = await fetch(`${appUrl}/api/swaps`, { method: "POST", headers: { cookie: technician, "content-type": "application/json", "idempotency-key": `bench-${runTag}-${i}` }, body: JSON.stringify(body) });
      if (response.status !== 201) throw new Error(`swap ${i}: ${response.status} ${await response.text()}`);
    };
    // The baseline swaps units already in stores (slot index modulo 10 of 7 or more) into other fitted positions.
    const baseSwap = async (i: number) => {
      const fittedSlot = i * 30 + 10;
      const aircraftId = Math.floor(fittedSlot / BENCH.positionsPerType) + 1;
      const typeId = ((aircraftId - 1) % BENCH.types) + 1;
      const positionId = (typeId - 1) * BENCH.positionsPerType + (fittedSlot % BENCH.positionsPerType) + 1;
      const onPartId = fittedSlot + 8 + 1; // slot modulo 10 of 8: a serviceable unit in stores
      const t = totalsOf.get(aircraftId)!;
      const response = await fetch(`${baseUrl}/swaps`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ aircraftId, positionId, onPartId, minutes: Number(t.minutes) + 60, cycles: Number(t.cycles) + 1 }) });
      if (response.status !== 200) throw new Error(`baseline swap ${i}: ${response.status} ${await response.text()}`);
    };
    const appSerial = p50(await timeEach(SERIAL_SWAPS, appSwap));
    const baseSerial = p50(await timeEach(SERIAL_SWAPS, baseSwap));
    figures.push(figure("POST /api/swaps p50, one client", "ms", appSerial, baseSerial, "<= 2"));
    const appRate = await throughput(CONCURRENT_SWAPS, CLIENTS, (i) => appSwap(SERIAL_SWAPS + i));
    const baseRate = await throughput(CONCURRENT_SWAPS, CLIENTS, (i) => baseSwap(SERIAL_SWAPS + i));
    figures.push(figure(`swaps/s at ${CLIENTS} concurrent clients`, "swaps/s", Math.round(appRate), Math.round(baseRate), "<= 2", true));

    for (const [name, route] of [["removals CSV throughput", "/api/exports/removals.csv"], ["ledger verify", "/api/ledger/verify"]] as const) {
      const status = (await fetch(`${appUrl}${route}`, { headers: { cookie: await signIn("admin") }, signal: AbortSignal.timeout(600_000) }).then((r) => { r.body?.cancel(); return r.status; }));
      if (status === 404) figures.push({ name, unit: "-", threadline: null, baseline: null, ratio: null, goal: "<= 2", met: null, note: `${route} is not in this branch: skipped` });
      else figures.push({ name, unit: "-", threadline: null, baseline: null, ratio: null, goal: "<= 2", met: null, note: `${route} answers ${status}; its measurement is not written yet` });
    }

    // The swap page's JavaScript before the scanner loads: the script tags of the first response, gzipped.
    const page = await get(`${appUrl}/aircraft/${registrationOf(1)}/swap`, technician);
    const scripts = [...new Set([...page.matchAll(/<script[^>]+src="([^"]+)"/g)].map((m) => m[1]))];
    let gzipBytes = 0;
    for (const src of scripts) gzipBytes += gzipSync(Buffer.from(await get(new URL(src, appUrl).toString(), technician))).byteLength;
    figures.push({ name: `swap page JavaScript before the scanner loads (${scripts.length} scripts)`, unit: "gzip bytes", threadline: gzipBytes, baseline: null, ratio: null, goal: "<= 250000", met: gzipBytes <= 250_000 });
  } finally {
    for (const stop of stoppers.reverse()) await stop().catch((error) => log(`while stopping: ${error}`));
  }

  const pad = (v: unknown, n: number) => String(v ?? "-").padEnd(n);
  console.log(`\n${pad("figure", 64)}${pad("unit", 12)}${pad("threadline", 12)}${pad("baseline", 10)}${pad("ratio", 7)}${pad("goal", 10)}met`);
  for (const f of figures) console.log(`${pad(f.name, 64)}${pad(f.unit, 12)}${pad(typeof f.threadline === "number" ? Math.round(f.threadline * 100) / 100 : null, 12)}${pad(typeof f.baseline === "number" ? Math.round(f.baseline * 100) / 100 : null, 10)}${pad(f.ratio, 7)}${pad(f.goal, 10)}${f.met ?? "-"}${f.note ? `  (${f.note})` : ""}`);
  writeFileSync(path.join(projectRoot, "bench", "results.json"), JSON.stringify({ figures }, null, 2) + "\n");
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
