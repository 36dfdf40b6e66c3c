import { instanceFor, stopMariadb } from "../server/db/mariadb.ts";
import { DATA_DIR, DB_PORT } from "./local-db.ts";

const stopped = await stopMariadb(instanceFor(DATA_DIR, DB_PORT));
console.log(stopped ? "Stopped MariaDB." : "MariaDB was not running.");
