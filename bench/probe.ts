import { startMariadb } from "../scripts/lib/mariadb";
import { BENCH, BENCH_DB_ARGS } from "./fleet-shape";
const server = await startMariadb({ dataDir: BENCH.dataDir, port: BENCH.dbPort, extraArgs: BENCH_DB_ARGS, log: console.log });
console.log("up", server.socket);
process.on("SIGTERM", async () => { await server.stop(); process.exit(0); });
setInterval(() => {}, 1 << 30);
