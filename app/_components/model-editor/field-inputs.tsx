"use client";

import { useState } from "react";
import { fieldChange, formatDelta } from "./deltas";
import { getAt, pathText, type PathPart } from "./draft-path";
import { useEditor } from "./editor-context";
import { numberToText, parseNumberText } from "./number-text";

export const cellInputClass =
  "w-full min-w-0 rounded border border-rule bg-white px-1.5 py-1 text-sm text-ink focus:border-copper focus:outline-none aria-[invalid=true]:border-danger aria-[invalid=true]:bg-danger-pale/40";

/** Δ against the base beside a field: a copper tick plus the number, so the change reads without colour. */
export function ChangeTag({ path }: { path: readonly PathPart[] }) {
  const { draft, base } = useEditor();
  const change = fieldChange(draft, base, path);
  if (change.kind === "same") return null;
  const text = change.kind === "new" ? "new" : change.delta === null ? "changed" : `Δ ${formatDelta(change.delta)}`;
  return (
    <span className="num mt-0.5 flex items-center gap-1 whitespace-nowrap text-[11px] leading-none text-copper-deep">
      <span aria-hidden className="inline-block h-1.5 w-1.5 rounded-full bg-copper" />
      {text}
      <span className="sr-only"> from the base release</span>
    </span>
  );
}

export function FieldMessages({ path }: { path: string }) {
  const { errorsAt, warningsAt, idFor } = useEditor();
  const errors = errorsAt(path);
  const warnings = warningsAt(path);
  if (!errors.length && !warnings.length) return null;
  return (
    <div id={`${idFor(path)}-msg`} className="mt-0.5 text-xs leading-snug">
      {errors.map((m) => (
        <p key={m} className="text-danger">
          <span aria-hidden>✕ </span>
          {m}
        </p>
      ))}
      {warnings.map((m) => (
        <p key={m} className="text-ink-soft">
          <span aria-hidden>! </span>
          {m}
        </p>
      ))}
    </div>
  );
}

function useFieldProps(path: readonly PathPart[]) {
  const api = useEditor();
  const key = pathText(path);
  const invalid = api.errorsAt(key).length > 0;
  const described = invalid || api.warningsAt(key).length > 0;
  return { api, key, props: { id: api.idFor(key), "aria-invalid": invalid, "aria-describedby": described ? `${api.idFor(key)}-msg` : undefined } };
}

/**
 * A number typed as text: half-typed input ("-", "1e") stays on screen while the draft holds the raw text, which the
 * validator then reports; `onValue` replaces the plain write (e.g. shell indices move their citations).
 */
export function NumberInput({ path, label, optional, onValue, className }: { path: readonly PathPart[]; label: string; optional?: boolean; onValue?: (value: unknown) => void; className?: string }) {
  const { api, key, props } = useFieldProps(path);
  const value = getAt(api.draft, path);
  const [text, setText] = useState(() => numberToText(value));
  const [seen, setSeen] = useState(value);
  if (seen !== value) {
    setSeen(value);
    if (parseNumberText(text, optional) !== value) setText(numberToText(value));
  }
  return (
    <div className={className}>
      <input
        {...props}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        aria-label={label}
        className={`${cellInputClass} num text-right`}
        value={text}
        onChange={(e) => {
          setText(e.target.value);
          const parsed = parseNumberText(e.target.value, optional);
          if (onValue) onValue(parsed);
          else api.set(path, parsed);
        }}
      />
      <ChangeTag path={path} />
      <FieldMessages path={key} />
    </div>
  );
}

export function TextInput({
  path,
  label,
  optional,
  multiline,
  visibleLabel,
  hideChange,
  className,
}: {
  path: readonly PathPart[];
  label: string;
  optional?: boolean;
  multiline?: boolean;
  visibleLabel?: boolean;
  /** For text whose change is already stated beside it (citations). */
  hideChange?: boolean;
  className?: string;
}) {
  const { api, key, props } = useFieldProps(path);
  const value = getAt(api.draft, path);
  const text = typeof value === "string" ? value : value === undefined ? "" : JSON.stringify(value);
  const write = (next: string) => api.set(path, next === "" && optional ? undefined : next);
  const shared = { ...props, value: text, className: cellInputClass, ...(visibleLabel ? {} : { "aria-label": label }) };
  return (
    <div className={className}>
      {visibleLabel ? (
        <label htmlFor={props.id} className="mb-0.5 block text-xs font-semibold text-ink-soft">
          {label}
        </label>
      ) : null}
      {multiline ? <textarea {...shared} rows={2} onChange={(e) => write(e.target.value)} /> : <input {...shared} type="text" onChange={(e) => write(e.target.value)} />}
      {hideChange ? null : <ChangeTag path={path} />}
      <FieldMessages path={key} />
    </div>
  );
}

export function SelectInput({ path, label, options, onValue, className }: { path: readonly PathPart[]; label: string; options: readonly string[]; onValue?: (value: string) => void; className?: string }) {
  const { api, key, props } = useFieldProps(path);
  const value = getAt(api.draft, path);
  const current = typeof value === "string" ? value : "";
  const choices = current && !options.includes(current) ? [current, ...options] : options;
  return (
    <div className={className}>
      <select {...props} aria-label={label} className={cellInputClass} value={current} onChange={(e) => (onValue ? onValue(e.target.value) : api.set(path, e.target.value))}>
        {current ? null : <option value="">choose…</option>}
        {choices.map((o) => (
          <option key={o} value={o}>
            {o}
          </option>
        ))}
      </select>
      <ChangeTag path={path} />
      <FieldMessages path={key} />
    </div>
  );
}
