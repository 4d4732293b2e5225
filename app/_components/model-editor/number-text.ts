const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * What a typed number becomes in the draft: a finite number when the text is one (a typographic minus is accepted),
 * otherwise the text itself, so the validator reports the field as not a number instead of the editor quietly keeping
 * an old value. Empty text on an optional field removes it.
 */
export function parseNumberText(text: string, optional = false): number | string | undefined {
  const clean = text.trim().replace(/^\u2212/, "-");
  if (clean === "" && optional) return undefined;
  const value = NUMBER.test(clean) ? Number(clean) : NaN;
  return Number.isFinite(value) ? value : text;
}

export function numberToText(value: unknown): string {
  if (typeof value === "number") return String(value);
  return typeof value === "string" ? value : "";
}
