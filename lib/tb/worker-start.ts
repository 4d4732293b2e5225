import { Worker, type WorkerOptions } from "node:worker_threads";

/**
 * Starts a worker thread from a module beside `here` (pass import.meta.url). Compiled JavaScript runs the `.js`
 * file directly; when the caller runs as TypeScript source (tsx), the thread does not inherit the TypeScript loader,
 * so it registers the loader before importing the `.ts` module.
 */
export function startModuleWorker(here: string, name: string, options: WorkerOptions = {}): Worker {
  if (!here.endsWith(".ts")) return new Worker(new URL(`./${name}.js`, here), options);
  const target = new URL(`./${name}.ts`, here).href;
  let api = "tsx/esm/api";
  try {
    api = import.meta.resolve(api);
  } catch {
    // keep the bare specifier: it resolves from the working directory
  }
  const code = `import(${JSON.stringify(api)}).then((m) => { m.register(); return import(${JSON.stringify(target)}); })`;
  return new Worker(code, { ...options, eval: true });
}
