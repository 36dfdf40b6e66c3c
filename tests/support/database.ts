import { randomBytes } from "node:crypto";
import { inject } from "vitest";
import { databaseUrl, dropDatabase, instanceFor, provisionDatabase } from "../../server/db/mariadb.ts";

/** A fresh, empty database on the run's MariaDB, for one test file. */
export function createTestDatabase() {
  const { dataDir, port } = inject("mariadb");
  const instance = instanceFor(dataDir, port);
  const credentials = { database: `t_${randomBytes(6).toString("hex")}`, user: "forthright_test", password: "test-password-not-secret" };
  provisionDatabase(instance, credentials);
  return {
    url: databaseUrl(instance, credentials),
    name: credentials.database,
    drop: () => dropDatabase(instance, credentials.database),
  };
}
