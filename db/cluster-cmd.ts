// `npm run cluster:up` / `cluster:down` / `cluster:status`: the three-node Galera cluster of
// db/cluster.ts. `up` bootstraps and joins the nodes in order, then creates the database and
// the app user and migrates (and seeds the demo labs) once, through node 1; Galera replicates
// it to the others. `up --fresh` starts from empty data directories.
import { loadLocalEnv } from "./local-env";
import { clusterDown, clusterNodes, clusterUp, nodeStatus, provisionCluster } from "./cluster";

loadLocalEnv();
const mode = process.argv[2] ?? "up";
const fresh = process.argv.includes("--fresh");
const say = (msg: string) => console.log(`\x1b[36m[forkwall cluster]\x1b[0m ${msg}`);
const nodes = clusterNodes();

if (mode === "up") {
  await clusterUp({ fresh, log: say });
  const env = await provisionCluster({ log: say });
  for (const n of nodes)
    say(`${n.name}: DB_PORT=${n.port} (DATABASE_URL=mysql://${env.DB_USER}:…@127.0.0.1:${n.port}/${env.DB_NAME})`);
  say("cluster left running; `npm run cluster:down` stops it");
} else if (mode === "down") {
  const stopped = await clusterDown({ log: say });
  say(stopped ? `${stopped} node(s) stopped` : "cluster was not running");
} else if (mode === "status") {
  for (const n of nodes) say(`${n.name} 127.0.0.1:${n.port} ${JSON.stringify(await nodeStatus(n))}`);
} else {
  console.error("usage: cluster-cmd up [--fresh] | down | status");
  process.exit(2);
}
process.exit(0);
