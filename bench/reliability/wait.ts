/** Polls `probe` every `everyMs` until it returns a truthy value (returned) or the ceiling passes (null). */
export async function pollUntil<T>(probe: () => Promise<T | null | undefined | false> | T | null | undefined | false, seconds: number, everyMs = 200): Promise<T | null> {
  const deadline = performance.now() + seconds * 1000;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (performance.now() > deadline) return null;
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

/** Like pollUntil, but a missed ceiling is a harness error naming what was awaited. */
export async function waitUntil<T>(what: string, probe: () => Promise<T | null | undefined | false> | T | null | undefined | false, seconds: number): Promise<T> {
  const value = await pollUntil(probe, seconds);
  if (value === null) throw new Error(`timed out after ${seconds} s waiting for ${what}`);
  return value;
}

/** The promise's value, or null when it has not settled within the ceiling. */
export function within<T>(promise: Promise<T>, seconds: number): Promise<T | null> {
  return Promise.race([promise, new Promise<null>((r) => setTimeout(() => r(null), seconds * 1000).unref())]);
}

export function pause(ms: number): Promise<void> {
  return new Promise((r) => setTimeout(r, ms));
}
