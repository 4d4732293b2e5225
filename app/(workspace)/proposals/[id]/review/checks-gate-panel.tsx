import { ACCEPTANCE_CRITERION_SCHEMA, type AcceptanceCriterion } from "@/lib/tb/analysis/acceptance";
import type { CheckResult, CheckStatus } from "@/lib/tb/analysis/check-result";

const STATUS: Record<CheckStatus, { glyph: string; word: string; tone: string }> = {
  pass: { glyph: "✓", word: "pass", tone: "text-ok" },
  warn: { glyph: "!", word: "warn", tone: "text-copper-deep" },
  fail: { glyph: "✕", word: "fail", tone: "text-danger" },
};

function describeCriterion(c: AcceptanceCriterion): string {
  switch (c.metric) {
    case "gap":
      return `Gap ${c.target} ± ${c.tolerance} eV`;
    case "gap-character":
      return `Gap is ${c.direct ? "direct" : "indirect"}`;
    case "mass":
      return `|m*|/mₑ at the ${c.edge === "vbm" ? "valence maximum" : "conduction minimum"} along (${c.direction.join(", ")}) ${c.target} ± ${c.tolerance}`;
    case "bandwidth":
      return `Width of band ${c.band + 1} ${c.target} ± ${c.tolerance} eV`;
    case "rms":
    case "max-error": {
      const what = c.metric === "rms" ? "RMS error" : "Max |error|";
      const scope = c.band === undefined ? "all bands" : `band ${c.band + 1}`;
      const window = c.window ? `, ${c.window[0]} to ${c.window[1]} eV` : "";
      return `${what} against the reference ≤ ${c.max} eV (${scope}${window}, ${c.alignment} alignment)`;
    }
  }
}

function StatusWord({ status }: { status: CheckStatus | null }) {
  if (!status) return <span className="font-semibold text-ink-soft">– not run</span>;
  const s = STATUS[status];
  return (
    <span className={`font-semibold ${s.tone}`}>
      {s.glyph} {s.word}
    </span>
  );
}

function Row({ status, title, detail }: { status: CheckStatus | null; title: string; detail: string }) {
  return (
    <li className="grid grid-cols-[5rem_1fr] gap-2 px-3 py-2">
      <StatusWord status={status} />
      <span>
        <span className="font-semibold">{title}</span>
        {detail ? <span className="block text-xs text-ink-soft">{detail}</span> : null}
      </span>
    </li>
  );
}

const LIST = "divide-y divide-rule rounded-lg border border-rule bg-card text-sm";
const HEADING = "mb-2 text-sm font-semibold";

/** The revision's checks, the family's acceptance criteria with whether each holds, and what still blocks acceptance. */
export function ChecksGatePanel({ checks, criteria, waivedReason, gateReasons }: { checks: CheckResult[]; criteria: unknown[]; waivedReason: string | null; gateReasons: string[] }) {
  const physics = checks.filter((c) => !c.id.startsWith("acceptance-"));
  const acceptance = criteria.map((raw, i) => {
    const parsed = ACCEPTANCE_CRITERION_SCHEMA.safeParse(raw);
    const result = checks.find((c) => c.id.startsWith(`acceptance-${i + 1}-`)) ?? null;
    return { i, text: parsed.success ? describeCriterion(parsed.data) : "Unreadable criterion (ask the family's curator)", result };
  });
  return (
    <div className="space-y-5">
      {waivedReason ? (
        <p className="rounded bg-copper-pale px-3 py-2 text-sm">
          ≈ Failing checks waived by a curator: <em>{waivedReason}</em>
        </p>
      ) : null}
      <div>
        <h3 className={HEADING}>Physics checks</h3>
        <ul className={LIST}>
          {physics.map((c) => (
            <Row key={c.id} status={c.status} title={c.title} detail={c.detail} />
          ))}
          {physics.length === 0 ? <li className="px-3 py-2 text-ink-soft">No checks have run on this revision.</li> : null}
        </ul>
      </div>
      <div>
        <h3 className={HEADING}>Acceptance criteria of the family</h3>
        <ul className={LIST}>
          {acceptance.map((a) => (
            <Row key={a.i} status={a.result?.status ?? null} title={a.text} detail={a.result ? a.result.detail : "not evaluated on this revision (the criteria changed after it was submitted)"} />
          ))}
          {acceptance.length === 0 ? <li className="px-3 py-2 text-ink-soft">The family sets no acceptance criteria.</li> : null}
        </ul>
      </div>
      <div>
        <h3 className={HEADING}>What still blocks acceptance</h3>
        {gateReasons.length > 0 ? (
          <ul className="list-none space-y-1 rounded-lg border border-copper bg-copper-pale/50 px-3 py-2 text-sm" data-testid="gate-reasons">
            {gateReasons.map((r) => (
              <li key={r}>✕ {r}</li>
            ))}
          </ul>
        ) : (
          <p className="rounded-lg border border-rule bg-card px-3 py-2 text-sm" data-testid="gate-reasons">
            ✓ Nothing: the gate would let this proposal move to accepted.
          </p>
        )}
      </div>
    </div>
  );
}
