import { readFileSync } from "node:fs";
import type { HttpSession } from "./http-session";

interface ReferenceManifest {
  node: Record<string, { filename?: string; exportedName?: string }>;
}

/** The id the build under test gave a server action: what a browser sends in the Next-Action header. */
export function actionId(filename: string, exportedName: string): string {
  const manifest = JSON.parse(readFileSync(".next/server/server-reference-manifest.json", "utf8")) as ReferenceManifest;
  const hit = Object.entries(manifest.node).find(([, a]) => a.filename === filename && a.exportedName === exportedName);
  if (!hit) throw new Error(`the build has no server action ${exportedName} in ${filename}`);
  return hit[0];
}

export interface ActionAnswer {
  ok: boolean;
  code?: string;
  error?: string;
  fieldErrors?: Record<string, string[]>;
}

/**
 * Submit a form to its server action over HTTP as React does in the browser for a useActionState form: a multipart
 * body with the form's fields under the "_1_" prefix, then field "0" listing the arguments (no previous state, then
 * that form; it must come last, the server reads fields in order). Returns the action's result from the flight rows.
 */
export async function submitAction(session: HttpSession, page: string, id: string, fields: Record<string, string>): Promise<ActionAnswer> {
  const body = new FormData();
  for (const [name, value] of Object.entries(fields)) body.append(`_1_${name}`, value);
  body.append("0", JSON.stringify(["$undefined", "$K1"]));
  const res = await session.fetch(page, { method: "POST", headers: { "next-action": id, origin: session.base, accept: "text/x-component" }, body });
  const text = await res.text();
  if (res.status !== 200) throw new Error(`the action answered ${res.status}: ${text.slice(0, 300)}`);
  for (const line of text.split("\n")) {
    const json = line.slice(line.indexOf(":") + 1);
    if (!json.startsWith("{")) continue;
    const value = JSON.parse(json) as Partial<ActionAnswer>;
    if (typeof value.ok === "boolean") return value as ActionAnswer;
  }
  throw new Error(`no action result in the answer: ${text.slice(0, 300)}`);
}
