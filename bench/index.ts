import { existsSync } from "node:fs";
import { runBandsBench } from "./bands";

const eigenBench = new URL("./eigen.ts", import.meta.url);
if (existsSync(eigenBench)) {
  const { runEigenBench } = (await import(eigenBench.href)) as { runEigenBench: () => Promise<void> };
  await runEigenBench();
} else {
  console.log("eigen-solver benchmark skipped: bench/eigen.ts is not there yet");
}
console.log("");
await runBandsBench();
