import { spawn, type ChildProcess } from "node:child_process";
import { createWriteStream, mkdirSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { reliabilitySettings } from "./settings";

export interface Exit {
  code: number | null;
  signal: NodeJS.Signals | null;
  at: number;
}

const running = new Set<ManagedProcess>();
const TAIL_CHARS = 4_000_000;

/**
 * A process the harness started, in its own process group (so a signal reaches everything it runs), with its output
 * appended to a log file and its group id recorded where scripts/reliability.sh stops it even if the harness dies.
 */
export class ManagedProcess {
  readonly exited: Promise<Exit>;
  exit: Exit | null = null;
  private tail = "";
  /** Characters of output so far; `tail` holds the last TAIL_CHARS of them. */
  private written = 0;
  private readonly listeners = new Set<() => void>();
  private readonly pidFile: string;

  constructor(
    readonly name: string,
    private readonly child: ChildProcess,
  ) {
    const { RELIABILITY_RUN_DIR } = reliabilitySettings();
    mkdirSync(join(RELIABILITY_RUN_DIR, "pids"), { recursive: true });
    this.pidFile = join(RELIABILITY_RUN_DIR, "pids", `${name}-${child.pid}.pid`);
    writeFileSync(this.pidFile, String(child.pid));
    const log = createWriteStream(join(RELIABILITY_RUN_DIR, `${name}.log`), { flags: "a" });
    const take = (chunk: Buffer) => {
      log.write(chunk);
      const text = chunk.toString("utf8");
      this.written += text.length;
      this.tail = (this.tail + text).slice(-TAIL_CHARS);
      for (const l of this.listeners) l();
    };
    child.stdout?.on("data", take);
    child.stderr?.on("data", take);
    running.add(this);
    this.exited = new Promise((resolve) =>
      child.on("exit", (code, signal) => {
        this.exit = { code, signal, at: performance.now() };
        running.delete(this);
        rmSync(this.pidFile, { force: true });
        log.end();
        resolve(this.exit);
      }),
    );
  }

  get pid(): number {
    return this.child.pid ?? 0;
  }

  /** A position in the output, for outputSince. */
  mark(): number {
    return this.written;
  }

  /** What the process printed since `mark` (as far as the kept tail reaches back). */
  outputSince(mark: number): string {
    return this.tail.slice(Math.max(0, this.tail.length - (this.written - mark)));
  }

  get alive(): boolean {
    return this.exit === null;
  }

  /** Signals the whole process group, as a service manager or an out-of-memory kill would hit it. */
  signal(sig: NodeJS.Signals): void {
    if (!this.alive) return;
    try {
      process.kill(-this.pid, sig);
    } catch {
      // already gone
    }
  }

  /** Resolves when the output matches, rejects at the ceiling or when the process exits first. */
  waitForOutput(pattern: RegExp, seconds: number): Promise<void> {
    return new Promise((resolve, reject) => {
      const done = (err?: Error) => {
        clearTimeout(timer);
        this.listeners.delete(check);
        if (err) reject(err);
        else resolve();
      };
      const check = () => pattern.test(this.tail) && done();
      const timer = setTimeout(() => done(new Error(`${this.name} did not print ${pattern} within ${seconds} s`)), seconds * 1000);
      this.exited.then((e) => done(new Error(`${this.name} exited (code ${e.code}, signal ${e.signal}) before printing ${pattern}`)));
      this.listeners.add(check);
      check();
    });
  }

  /** SIGTERM, then SIGKILL if it has not exited within the grace period. */
  async stop(graceSeconds = 20): Promise<Exit> {
    if (this.exit) return this.exit;
    this.signal("SIGTERM");
    const timer = setTimeout(() => this.signal("SIGKILL"), graceSeconds * 1000);
    const exit = await this.exited;
    clearTimeout(timer);
    return exit;
  }
}

export function startProcess(name: string, args: string[], env: Record<string, string | undefined> = {}): ManagedProcess {
  const child = spawn(process.execPath, args, { detached: true, stdio: ["ignore", "pipe", "pipe"], env: { ...process.env, ...env } });
  return new ManagedProcess(name, child);
}

export async function stopAll(): Promise<void> {
  await Promise.all([...running].map((p) => p.stop(10)));
}

/** The production build on the configured port; ready when /api/health answers 200 (it reaches PostgreSQL). */
export async function startWeb(): Promise<ManagedProcess> {
  const { RELIABILITY_WEB_PORT, baseUrl } = reliabilitySettings();
  const web = startProcess("web", ["node_modules/next/dist/bin/next", "start", "-p", String(RELIABILITY_WEB_PORT), "-H", "127.0.0.1"]);
  const deadline = Date.now() + 180_000;
  while (Date.now() < deadline && web.alive) {
    const ok = await fetch(`${baseUrl}/api/health`, { signal: AbortSignal.timeout(10_000) }).then((r) => r.ok, () => false);
    if (ok) return web;
    await Promise.race([new Promise((r) => setTimeout(r, 250)), web.exited]);
  }
  await web.stop(5);
  throw new Error(`next start did not become ready on ${baseUrl} (see ${reliabilitySettings().RELIABILITY_RUN_DIR}/web.log)`);
}

/** The pg-boss worker as npm start runs it, in one process (no tsx wrapper, so a signal reaches the worker itself). */
export async function startWorker(): Promise<ManagedProcess> {
  const worker = startProcess("worker", ["--conditions=react-server", "--import", "tsx", "lib/jobs/worker-main.ts"]);
  await worker.waitForOutput(/taking jobs/, 180);
  return worker;
}
