// Which statements one request sends to MariaDB, read from the server's general log. The bench
// uses it to check that each bare baseline runs the same SQL as the app route it is compared with
// (same count of statements; `--show-sql` prints both lists), so a ratio measures the framework and
// the code around the SQL, not a different amount of database work.
import mysql from "mysql2/promise";

export interface SqlLog {
  /** The statements sent while `work` ran, in order (Query and Execute commands only). */
  capture(work: () => Promise<unknown>): Promise<string[]>;
  close(): Promise<void>;
}

export async function openSqlLog(socketPath: string): Promise<SqlLog> {
  // The root account over the server's own socket: only it may switch the general log on.
  const admin = await mysql.createConnection({ socketPath, user: "root" });
  await admin.query("SET GLOBAL log_output = 'TABLE'");
  return {
    async capture(work) {
      await admin.query("TRUNCATE mysql.general_log");
      await admin.query("SET GLOBAL general_log = 1");
      try {
        await work();
      } finally {
        await admin.query("SET GLOBAL general_log = 0");
      }
      const [rows] = await admin.query(
        "SELECT CONVERT(argument USING utf8mb4) AS statement FROM mysql.general_log WHERE command_type IN ('Query', 'Execute') AND thread_id <> CONNECTION_ID() ORDER BY event_time",
      );
      return (rows as Array<{ statement: string }>)
        .map((row) => row.statement.replace(/\s+/g, " ").trim())
        .filter((statement) => !/^SET GLOBAL general_log/i.test(statement));
    },
    close: () => admin.end(),
  };
}

/** A statement with its literal values blanked out, so the app's and the baseline's lists compare. */
export function statementShape(statement: string): string {
  return statement
    .replace(/'(?:[^'\\]|\\.)*'/g, "?")
    .replace(/\b\d+(\.\d+)?\b/g, "?")
    .replace(/`/g, "")
    .slice(0, 160);
}
