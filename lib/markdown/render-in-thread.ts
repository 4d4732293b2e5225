import { Worker } from "node:worker_threads";
import { toHtml } from "hast-util-to-html";
import { startModuleWorker } from "@/lib/tb/worker-start";
import { RENDER_TIME_LIMIT_MS } from "./bounds";
import type { RenderedMarkdown, SanitizedHtml } from "./render";
import type { RenderReply, RenderRequest } from "./render-protocol";

interface Job {
  resolve: (r: RenderedMarkdown) => void;
  reject: (e: Error) => void;
  timer: NodeJS.Timeout;
}

interface RenderThread {
  worker: Worker;
  jobs: Map<number, Job>;
}

let current: RenderThread | null = null;
let nextId = 0;

// The thread keeps the process alive only while a text waits for it (a script may end once its renders are done).
function finish(thread: RenderThread, id: number): Job | undefined {
  const job = thread.jobs.get(id);
  if (!job) return undefined;
  thread.jobs.delete(id);
  clearTimeout(job.timer);
  if (thread.jobs.size === 0) thread.worker.unref();
  return job;
}

function startThread(): RenderThread {
  // Next's bundler compiles the thread module from this literal URL; under tsx or vitest the source runs through tsx.
  const worker = process.env.NEXT_RUNTIME ? new Worker(new URL("./render-thread.ts", import.meta.url)) : startModuleWorker(import.meta.url, "render-thread");
  const thread: RenderThread = { worker, jobs: new Map() };
  worker.unref();
  worker.on("message", (reply: RenderReply) => {
    const job = finish(thread, reply.id);
    if (!job) return;
    if (reply.ok) job.resolve(reply.rendered);
    else job.reject(new Error(reply.message));
  });
  const fail = (error: Error) => {
    if (current === thread) current = null;
    for (const id of [...thread.jobs.keys()]) finish(thread, id)?.reject(error);
  };
  worker.on("error", fail);
  worker.on("exit", (code) => fail(new Error(`markdown render thread exited (${code})`)));
  return thread;
}

/** Shown when a text could not be rendered in time: its source as plain text, never an error page. */
export function unrenderedText(text: string): RenderedMarkdown {
  const html = toHtml([
    { type: "element", tagName: "p", properties: { className: ["math-too-large-label"] }, children: [{ type: "text", value: "too large to render" }] },
    { type: "element", tagName: "pre", properties: {}, children: [{ type: "text", value: text }] },
  ]);
  return { html: html as SanitizedHtml, formulas: 0, refused: 0 };
}

/**
 * Renders user markdown in a long-lived worker thread, so a slow text never holds up other requests. A render
 * over RENDER_TIME_LIMIT_MS ends its thread (texts still waiting there are refused too; a fresh thread takes the
 * next text) and rejects.
 */
export function renderInThread(text: string): Promise<RenderedMarkdown> {
  const thread = (current ??= startThread());
  const id = nextId++;
  return new Promise<RenderedMarkdown>((resolve, reject) => {
    const timer = setTimeout(() => {
      if (current === thread) current = null;
      finish(thread, id)?.reject(new Error(`markdown render took over ${RENDER_TIME_LIMIT_MS} ms`));
      void thread.worker.terminate();
    }, RENDER_TIME_LIMIT_MS);
    thread.jobs.set(id, { resolve, reject, timer });
    thread.worker.ref();
    thread.worker.postMessage({ id, text } satisfies RenderRequest);
  });
}
