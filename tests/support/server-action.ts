import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";

interface ManifestEntry {
  filename?: string;
  exportedName?: string;
}

let manifest: Record<string, ManifestEntry> | undefined;

/** The id `next build` gave a server action, from the build's own manifest. */
export function serverActionId(file: string, exportName: string): string {
  manifest ??= (JSON.parse(readFileSync(".next/server/server-reference-manifest.json", "utf8")) as { node: Record<string, ManifestEntry> }).node;
  const found = Object.entries(manifest).find(([, e]) => e.filename === file && e.exportedName === exportName);
  if (!found) throw new Error(`no server action ${exportName} in ${file} in the build (run next build)`);
  return found[0];
}

/**
 * The multipart body React sends for `action(previousState, formData)`: field "0" holds the argument list, in which
 * "$K1" stands for the form whose fields follow with the prefix "_1_".
 */
export function serverActionBody(fields: Record<string, string>): { body: string; contentType: string } {
  const boundary = `----bandgate-${randomUUID()}`;
  // The argument list comes last, as React sends it: the form's fields must have arrived when it is read.
  const parts = [...Object.entries(fields).map(([k, v]) => [`_1_${k}`, v]), ["0", JSON.stringify([null, "$K1"])]];
  const body =
    parts.map(([name, value]) => `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`).join("") +
    `--${boundary}--\r\n`;
  return { body, contentType: `multipart/form-data; boundary=${boundary}` };
}
