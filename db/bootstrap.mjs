// First step of `npm start`, `npm test` and friends. Plain Node with no dependencies, because it
// runs before node_modules exists: installs the Debian packages and npm modules that are
// missing, then hands over to the TypeScript entry point for the command.
import { execFileSync, spawn } from "node:child_process";
import { existsSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
process.chdir(root);

const COMMANDS = {
  start: { entry: "db/start.ts", args: ["serve"], packages: ["server"] },
  dev: { entry: "db/start.ts", args: ["dev"], packages: ["server"] },
  "db:stop": { entry: "db/start.ts", args: ["stop"], packages: [] },
  "db:up": { entry: "db/start.ts", args: ["up"], packages: ["server"] },
  "db:backup": { entry: "db/backup.ts", args: ["backup"], packages: ["server"] },
  "db:restore": { entry: "db/backup.ts", args: ["restore"], packages: ["server"] },
  "lab:create": { entry: "db/lab-create.ts", args: [], packages: ["server"] },
  test: { entry: "tests/run.ts", args: [], packages: ["server", "galera", "browser", "tools"] },
  bench: { entry: "tests/bench/poster.ts", args: [], packages: ["server"] },
  "bench:http": { entry: "tests/bench/http.ts", args: [], packages: ["server"] },
  "cluster:up": { entry: "db/cluster-cmd.ts", args: ["up"], packages: ["server", "galera"] },
  "cluster:down": { entry: "db/cluster-cmd.ts", args: ["down"], packages: ["server"] },
  "cluster:status": { entry: "db/cluster-cmd.ts", args: ["status"], packages: ["server"] },
  "test:cluster": { entry: "tests/cluster/run.ts", args: [], packages: ["server", "galera"] },
  "bench:cluster": { entry: "tests/bench/cluster.ts", args: [], packages: ["server", "galera"] },
  "bench:stock": { entry: "tests/bench/stock-import.ts", args: [], packages: ["server"] },
};

// Debian package -> a file that proves it is installed.
const PACKAGES = {
  server: [
    ["mariadb-server", "/usr/sbin/mariadbd"],
    ["mariadb-client", "/usr/bin/mariadb"],
  ],
  // Galera itself (galera-4) comes with mariadb-server; state transfer to a joining node needs
  // mariabackup and socat.
  galera: [
    ["galera-4", "/usr/lib/galera/libgalera_smm.so"],
    ["mariadb-backup", "/usr/bin/mariabackup"],
    ["socat", "/usr/bin/socat"],
  ],
  browser: [["chromium", "/usr/bin/chromium"]],
  tools: [
    ["poppler-utils", "/usr/bin/pdftoppm"],
    ["zbar-tools", "/usr/bin/zbarimg"],
  ],
};

const [command, ...rest] = process.argv.slice(2);
const spec = COMMANDS[command];
if (!spec) {
  console.error(`usage: node db/bootstrap.mjs ${Object.keys(COMMANDS).join("|")}`);
  process.exit(2);
}

function say(msg) {
  console.log(`\x1b[36m[forkwall]\x1b[0m ${msg}`);
}

function ensureDebianPackages(groups) {
  const missing = groups
    .flatMap((g) => PACKAGES[g])
    .filter(([, file]) => !existsSync(file))
    .map(([pkg]) => pkg);
  if (missing.length === 0) return;
  const isRoot = process.getuid?.() === 0;
  const sudo = isRoot ? [] : ["sudo"];
  say(`installing Debian packages: ${missing.join(" ")}`);
  try {
    const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
    const run = (args) =>
      execFileSync(sudo[0] ?? args[0], sudo.length ? args : args.slice(1), { stdio: "inherit", env });
    run(["apt-get", "update", "-qq"]);
    run(["apt-get", "install", "-y", "-qq", "--no-install-recommends", ...missing]);
  } catch {
    console.error(`Could not install ${missing.join(", ")}. Install them with apt-get (as root) and run again.`);
    process.exit(1);
  }
}

function ensureNodeModules() {
  const marker = path.join("node_modules", ".package-lock.json");
  const stale = !existsSync(marker) || statSync(marker).mtimeMs < statSync("package-lock.json").mtimeMs;
  if (!stale) return;
  say("installing npm packages (npm ci)");
  execFileSync("npm", ["ci", "--no-audit", "--no-fund"], {
    stdio: "inherit",
    env: { ...process.env, PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: "1" },
  });
}

ensureDebianPackages(spec.packages);
ensureNodeModules();

// Database code is marked server-only (react-server); the bench renders React, so it is not.
const conditions = command === "bench" ? [] : ["--conditions=react-server"];
const child = spawn(process.execPath, [...conditions, "--import", "tsx", spec.entry, ...spec.args, ...rest], {
  stdio: "inherit",
  env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: "1" },
});
// The child receives Ctrl-C from the terminal itself; wait for its clean shutdown.
for (const sig of ["SIGINT", "SIGTERM", "SIGHUP"]) {
  process.on(sig, () => {
    if (sig !== "SIGINT") child.kill(sig);
  });
}
child.on("exit", (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
