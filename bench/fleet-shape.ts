// The invented fleet-scale data set the benchmarks run on, shared by the generator and the runner.
import path from "node:path";
import { projectRoot } from "../scripts/lib/services";

export const BENCH = {
  dataDir: path.join(projectRoot, "bench", ".data"),
  database: "threadline_bench",
  dbPort: Number(process.env.BENCH_DB_PORT ?? 3407),
  types: 2,
  positionsPerType: 500,
  partNumbers: 2000,
  aircraft: 200,
  parts: 100_000,
  /** Rounds of install/removal every unit went through before the present. */
  rounds: 4,
  /** Fraction of units fitted now (slot index modulo 10 below this). */
  fittedTenths: 7,
} as const;

export const registrationOf = (aircraftId: number) => `Q-B${String(aircraftId).padStart(3, "0")}`;
export const positionCodeOf = (index: number) => `P${String(index + 1).padStart(3, "0")}`;
export const partNumberOf = (id: number) => `BX-${String(id).padStart(4, "0")}`;
export const BENCH_CAGE = "Q9Z01";
/** mariadbd options for the benchmarks: a buffer pool that holds the whole data set. */
export const BENCH_DB_ARGS = ["--innodb-buffer-pool-size=1G", "--innodb-log-file-size=512M"];
