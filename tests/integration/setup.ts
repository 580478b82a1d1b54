// Integration tests talk to the real MariaDB test database that tests/run.ts provisions.
import { loadLocalEnv } from "../../db/local-env";

process.env.DB_NAME ??= "forkwall_test";
loadLocalEnv();
if (!process.env.DB_NAME.endsWith("_test")) {
  throw new Error(
    `Integration tests refuse to run against ${process.env.DB_NAME}: use a *_test database (npm test does).`,
  );
}
