import type { BoardCard } from "../card";

/** The verdict tally, blocking remarks and checks, spelled out (glyph + word, never colour alone). */
export function CardFacts({ card }: { card: BoardCard }) {
  const t = card.tally;
  const verdicts = [
    t.accept ? `${t.accept} accept` : null,
    t.minor_revision ? `${t.minor_revision} minor` : null,
    t.major_revision ? `${t.major_revision} major` : null,
    t.decline ? `${t.decline} decline` : null,
  ].filter(Boolean);
  const checks = card.checksPassing ? "✓ checks pass" : card.checksWaived ? "≈ checks waived" : "✕ checks fail";
  return (
    <ul className="mt-2 flex flex-wrap gap-x-3 gap-y-0.5 text-xs text-ink-soft">
      <li>
        verdicts: {verdicts.length ? verdicts.join(", ") : "none"}
        {t.stale ? ` (+${t.stale} stale)` : ""} · needs {card.requiredAccepts}
      </li>
      {card.openBlockingRemarks > 0 ? <li className="font-semibold text-danger">⚑ {card.openBlockingRemarks} blocking</li> : null}
      <li className={card.checksPassing || card.checksWaived ? "" : "font-semibold text-danger"}>{checks}</li>
    </ul>
  );
}
