/** One malformed input: where it goes, as whom, and how to tell a refusal from an acceptance. */
export interface RequestSpec {
  method: "GET" | "POST";
  path: string;
  headers?: Record<string, string>;
  body?: Buffer | string | FormData;
}

export interface CaseContext {
  /** The proposal's current card version (writes based on an older one are refused as stale, which tests nothing). */
  versionOf(proposalId: string): Promise<number>;
}

export interface BadCase {
  /** The route as a template, e.g. "POST /api/proposals/:id/revisions". */
  route: string;
  summary: string;
  /** author: the board author's session cookie; token: the raised-limit API token; none: anonymous. */
  auth: "author" | "token" | "none";
  /** status: ≥ 400 is a refusal; action: a server action's result says ok or not. */
  judge: "status" | "action";
  build(ctx: CaseContext): Promise<RequestSpec> | RequestSpec;
}

export const JSON_TYPE = "application/json";
