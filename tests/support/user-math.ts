/** A display formula as markdown, $$ on lines of their own. */
export const displayMath = (tex: string) => `$$\n${tex}\n$$\n`;

/**
 * 233 characters of markdown: three nested macro definitions expanding to 8 × 25 × 25 = 5,000 square roots, about
 * 7 MB of HTML and several seconds of one core when rendered without bounds (KaTeX limits expansions, not output).
 */
export const MACRO_BOMB = displayMath(
  String.raw`\def\a{\sqrt{x}\sqrt{x}\sqrt{x}\sqrt{x}\sqrt{x}\sqrt{x}\sqrt{x}\sqrt{x}}\def\b{\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a\a}\def\c{\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b\b}\c`,
);

export const TOO_LARGE = "formula too large";
