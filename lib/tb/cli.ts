import { computeBands } from "./bands";
import { checkDocument, type CheckStep } from "./cli-check";
import { runDocumentChecks } from "./analysis/checks";
import { InputError, option, positional, readJsonFile, readKPoints, readModel } from "./cli-io";
import { realSpaceHoppings } from "./hoppings";
import { samplePath } from "./kpath";
import { compileModel } from "./model";

const USAGE = `usage:
  tb bands --model FILE.json --kpoints FILE.json   energies at the given fractional k-points
  tb path FILE.json [--points N]                    bands on the document's default k-path
  tb hoppings FILE.json                             real-space hopping list
  tb check FILE.json                                validation, conventions and checks`;

const physicsChecks: CheckStep = (doc) => runDocumentChecks(doc).map(({ id, title, status, detail }) => ({ id, title, status, detail }));

const rows = (energies: Float64Array[]) => energies.map((e) => Array.from(e));

async function run(args: string[]): Promise<number> {
  const [command, ...rest] = args;
  switch (command) {
    case "bands": {
      const doc = readModel(option(rest, "model"));
      const model = compileModel(doc);
      const k = readKPoints(option(rest, "kpoints"), model.dimension);
      print({ energies: rows(computeBands(model, k).energies) });
      return 0;
    }
    case "path": {
      const doc = readModel(positional(rest));
      const pointsText = option(rest, "points");
      const points = pointsText === undefined ? undefined : Number(pointsText);
      if (points !== undefined && !(Number.isInteger(points) && points >= 2)) throw new InputError("--points must be an integer ≥ 2");
      const path = samplePath(doc, points);
      const bands = computeBands(compileModel(doc), path.kFrac);
      print({ ticks: path.ticks, distance: path.distance, fractional: path.kFrac, energies: rows(bands.energies) });
      return 0;
    }
    case "hoppings": {
      const doc = readModel(positional(rest));
      print({ hoppings: realSpaceHoppings(compileModel(doc), doc.sites.map((s) => s.position)) });
      return 0;
    }
    case "check": {
      const report = await checkDocument(readJsonFile(positional(rest), "model"), [physicsChecks]);
      print(report);
      if (!report.valid) return 2;
      return report.checks.some((c) => c.status === "fail") ? 1 : 0;
    }
    default:
      throw new InputError(command ? `unknown command "${command}"\n${USAGE}` : USAGE);
  }
}

function print(value: unknown): void {
  process.stdout.write(JSON.stringify(value) + "\n");
}

run(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    process.stderr.write(`tb: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exitCode = 2;
  },
);
