import { runBandsBench } from "./bands";
import { runEigenBench } from "./eigen";

/** npm run bench: every speed goal, as ratios against references measured in the same run. */
await runEigenBench();
console.log("");
await runBandsBench();
