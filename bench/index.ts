import { closeDb } from "@/db/client";
import { runApiBench } from "./api";
import { runBandsBench } from "./bands";
import { runBoardBench } from "./board";
import { runEigenBench } from "./eigen";
import { runEngineLoadBench } from "./engine-load";
import { runFitBench } from "./fit";

/** npm run bench: every speed goal, as ratios against references measured in the same run. */
await runEigenBench();
console.log("");
await runBandsBench();
console.log("");
await runFitBench();
console.log("");
await runBoardBench();
console.log("");
await runApiBench();
console.log("");
await runEngineLoadBench();
await closeDb();
