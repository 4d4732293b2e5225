import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import type { HttpSession } from "./http-session";

interface ManifestEntry {
  filename: string;
  exportedName: string;
}

/** The id `next build` gave a server action, read from the build's manifest (ids change with every build). */
export function serverActionId(filename: string, exportedName: string): string {
  const manifest = JSON.parse(readFileSync(".next/server/server-reference-manifest.json", "utf8")) as { node: Record<string, ManifestEntry> };
  const hit = Object.entries(manifest.node).find(([, e]) => e.filename === filename && e.exportedName === exportedName);
  if (!hit) throw new Error(`no server action ${exportedName} in ${filename} (build the app first)`);
  return hit[0];
}

export interface UploadedFile {
  name: string;
  type: string;
  content: string;
}

/**
 * A multipart body written by hand, so a file name travels exactly as given: percent-encoded in `filename*`
 * (RFC 5987), which the server's multipart parser decodes.
 */
function multipart(fields: [string, string | UploadedFile][]): { body: string; contentType: string } {
  const boundary = `----bandgate-test-${randomUUID()}`;
  const parts = fields.map(([name, value]) => {
    if (typeof value === "string") return `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
    const disposition = `form-data; name="${name}"; filename="upload"; filename*=UTF-8''${encodeURIComponent(value.name)}`;
    return `--${boundary}\r\nContent-Disposition: ${disposition}\r\nContent-Type: ${value.type}\r\n\r\n${value.content}\r\n`;
  });
  return { body: `${parts.join("")}--${boundary}--\r\n`, contentType: `multipart/form-data; boundary=${boundary}` };
}

/** The multipart body React sends for `action(previousState, formData)`: the form's fields under the prefix "_1_",
 * then field "0" with the argument list (last, so the fields have arrived when it is read). */
export function serverActionBody(fields: Record<string, string | UploadedFile>): { body: string; contentType: string } {
  const entries: [string, string | UploadedFile][] = Object.entries(fields).map(([k, v]) => [`_1_${k}`, v]);
  entries.push(["0", JSON.stringify([null, "$K1"])]);
  return multipart(entries);
}

/**
 * Calls a `(prevState, formData)` server action the way React's client does: the form's fields carry the prefix
 * "_1_" (the form is part 1), then field "0" holds the arguments `[null, "$K1"]`.
 */
export async function callServerAction(
  session: HttpSession,
  page: string,
  actionId: string,
  fields: Record<string, string | UploadedFile>,
  headers: Record<string, string> = {},
): Promise<{ status: number; text: string }> {
  const { body, contentType } = serverActionBody(fields);
  const res = await session.fetch(page, {
    method: "POST",
    headers: { accept: "text/x-component", "next-action": actionId, "content-type": contentType, ...headers },
    body,
  });
  return { status: res.status, text: await res.text() };
}

export interface ActionOutcome {
  ok: boolean;
  code?: string;
  error?: string;
  data?: unknown;
  fieldErrors?: Record<string, string[]>;
}

/** The ActionResult inside an action's answer (the flight row that holds `"ok":`), or null when there is none. */
export function actionResult(text: string): ActionOutcome | null {
  for (const line of text.split("\n")) {
    const json = line.slice(line.indexOf(":") + 1);
    if (!json.startsWith("{") || !json.includes('"ok":')) continue;
    try {
      return JSON.parse(json) as ActionOutcome;
    } catch {
      continue;
    }
  }
  return null;
}
