/** A number in the monospace face with tabular figures; decimals line up in right-aligned columns. */
export function NumberCell({ value, digits = 3, unit }: { value: number; digits?: number; unit?: string }) {
  const text = value.toFixed(digits).replace("-", "−");
  return (
    <td className="num whitespace-nowrap px-3 py-1.5 text-right">
      {text}
      {unit ? <span className="ml-1 text-xs text-ink-soft">{unit}</span> : null}
    </td>
  );
}
