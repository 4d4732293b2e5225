import type { TextDiffLine } from "@/lib/review/text-diff";

/** Neutral tints: removed lines slate-grey, added lines copper-pale; the glyph says which, never the colour alone. */
const TINT: Record<TextDiffLine["kind"], string | undefined> = {
  same: undefined,
  removed: "color-mix(in oklab, var(--color-slate-line) 16%, var(--color-card))",
  added: "color-mix(in oklab, var(--color-copper) 18%, var(--color-card))",
};
const GLYPH: Record<TextDiffLine["kind"], string> = { same: "", removed: "−", added: "+" };
const WORD: Record<TextDiffLine["kind"], string> = { same: "", removed: "removed: ", added: "added: " };

const numberCell = "num select-none px-2 py-0.5 text-right align-top text-ink-soft";

export function DiffLineCells({ line, numbers, divider = false }: { line: TextDiffLine | null; numbers: (number | null)[]; divider?: boolean }) {
  const background = line ? TINT[line.kind] : "var(--color-paper)";
  const edge = divider ? "border-l border-rule" : "";
  return (
    <>
      {numbers.map((n, i) => (
        <td key={i} className={`${numberCell} ${i === 0 ? edge : ""}`} style={{ backgroundColor: background }}>
          {n ?? ""}
        </td>
      ))}
      <td aria-hidden="true" className="num select-none py-0.5 text-center align-top font-semibold text-ink-soft" style={{ backgroundColor: background }}>
        {line ? GLYPH[line.kind] : ""}
      </td>
      <td className="num whitespace-pre-wrap py-0.5 pr-2 align-top [overflow-wrap:anywhere]" style={{ backgroundColor: background }}>
        {line ? <><span className="sr-only">{WORD[line.kind]}</span>{line.text}</> : null}
      </td>
    </>
  );
}

export function ShowUnchanged({ count, columns, onShow }: { count: number; columns: number; onShow: () => void }) {
  return (
    <tr className="bg-paper">
      <td colSpan={columns} className="px-2 py-1 text-center">
        <button type="button" onClick={onShow} className="text-xs text-copper-deep underline">
          Show {count} unchanged lines
        </button>
      </td>
    </tr>
  );
}
