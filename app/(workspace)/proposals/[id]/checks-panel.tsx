import type { CheckResult } from "@/lib/tb/analysis/check-result";

const GLYPH = { pass: "✓", warn: "!", fail: "✕" } as const;

export function ChecksPanel({ checks, waivedReason }: { checks: CheckResult[]; waivedReason: string | null }) {
  return (
    <div>
      {waivedReason ? (
        <p className="mb-2 rounded bg-copper-pale px-3 py-2 text-sm">
          ≈ Failing checks waived by a curator: <em>{waivedReason}</em>
        </p>
      ) : null}
      <ul className="divide-y divide-rule rounded-lg border border-rule bg-card text-sm">
        {checks.map((c) => (
          <li key={c.id} className="grid grid-cols-[4.5rem_1fr] gap-2 px-3 py-2">
            <span className={`font-semibold ${c.status === "fail" ? "text-danger" : c.status === "warn" ? "text-copper-deep" : "text-ok"}`}>
              {GLYPH[c.status]} {c.status}
            </span>
            <span>
              <span className="font-semibold">{c.title}</span>
              <span className="block text-xs text-ink-soft">{c.detail}</span>
            </span>
          </li>
        ))}
      </ul>
    </div>
  );
}
