/**
 * `npm run bench`: runs every benchmark suite and prints one table. Suites measure; they never
 * fail the build on time (targets are printed beside the measurement for a human to judge).
 */
import { run as hydrology } from "./hydrology";
import { run as split } from "./split";
import { run as ingest } from "./ingest";
import { run as readers } from "./readers";
import { run as compute } from "./compute";
import { run as foreignData } from "./foreign-data";
import { run as tiles } from "./tiles";
import { run as mapDesk } from "./map";
import { run as load } from "./load";
import { run as accounts } from "./auth";
import { run as terrainFlow } from "./terrain-flow";
import { formatTable, type BenchRow } from "./table";

const suites: Array<{ name: string; run: () => Promise<BenchRow[]> }> = [
  { name: "engineering core", run: hydrology },
  { name: "flow path split", run: split },
  { name: "file readers", run: readers },
  { name: "layer upload pipeline", run: ingest },
  { name: "demo compute", run: compute },
  { name: "compute among other teams' data", run: foreignData },
  { name: "map tiles", run: tiles },
  { name: "map desk", run: mapDesk },
  { name: "several processes", run: load },
  { name: "accounts", run: accounts },
  { name: "terrain flow", run: terrainFlow },
];

const rows: Array<BenchRow & { suite: string }> = [];
for (const suite of suites) {
  for (const row of await suite.run()) rows.push({ ...row, suite: suite.name });
}
console.log(formatTable(rows));
