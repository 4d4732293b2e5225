import type { DocumentIssue } from "@/lib/tb/document";
import { getAt, type Draft } from "./draft-path";

/** The validator's message, with the schema's type jargon turned into what the modeller typed. */
export function plainIssueMessage(issue: DocumentIssue, draft: Draft): string {
  const typed = getAt(draft, issue.path.split(/[.[\]]/).filter(Boolean).map((p) => (/^\d+$/.test(p) ? Number(p) : p)));
  if (/expected number, received string/.test(issue.message)) return typed === "" ? "enter a number" : `“${String(typed)}” is not a number`;
  if (/expected number, received undefined/.test(issue.message)) return "enter a number";
  if (/expected string, received undefined/.test(issue.message)) return "required";
  return issue.message;
}
