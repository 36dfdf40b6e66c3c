import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { freePort } from "./ports.ts";
import type { TestProject } from "vitest/node";
import { ensureMariadbInstalled, instanceFor, removeDataDir, startMariadb, stopMariadb } from "../../server/db/mariadb.ts";


/** One throwaway MariaDB for the whole run, on a free port in a temporary directory; each test file makes its own database. */
export default async function setup(project: TestProject) {
  ensureMariadbInstalled();
  const dir = mkdtempSync(path.join(tmpdir(), "forthright-test-db-"));
  const instance = instanceFor(dir, await freePort());
  await startMariadb(instance);
  project.provide("mariadb", { socket: instance.socket, port: instance.port, dataDir: instance.dataDir });
  return async () => {
    await stopMariadb(instance);
    removeDataDir(instance);
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    mariadb: { socket: string; port: number; dataDir: string };
  }
}
