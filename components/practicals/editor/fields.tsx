"use client";

import { createContext, useContext, useState, type InputHTMLAttributes, type ReactNode } from "react";
import { Field, Input, Select, Textarea } from "@/components/ui/field";
import { cn } from "@/lib/utils";
import { errorsAt, fieldDomId, type FieldErrors } from "../draft";
import { formatStoredNumber, parseTypedNumber, textMatchesValue } from "../numbers";

/** The field errors of the draft being edited, keyed by path ("content.checks.0.y"). */
export const EditorErrorsContext = createContext<FieldErrors>({});

export function useFieldErrors(path: string): string[] | undefined {
  return errorsAt(useContext(EditorErrorsContext), path);
}

/** All messages at a path or below it (for a card that holds several fields). */
export function useErrorsUnder(path: string): number {
  const errors = useContext(EditorErrorsContext);
  return Object.keys(errors).filter((k) => k === path || k.startsWith(`${path}.`)).length;
}

type TextProps = {
  path: string;
  label: ReactNode;
  hint?: ReactNode;
  value: string;
  onChange: (value: string) => void;
  className?: string;
  inputProps?: Omit<InputHTMLAttributes<HTMLInputElement>, "id" | "value" | "onChange">;
};

export function TextField({ path, label, hint, value, onChange, className, inputProps }: TextProps) {
  const errors = useFieldErrors(path);
  return (
    <Field id={fieldDomId(path)} label={label} hint={hint} error={errors} className={className}>
      {(p) => <Input {...p} {...inputProps} value={value} onChange={(e) => onChange(e.target.value)} />}
    </Field>
  );
}

export function TextAreaField({ path, label, hint, value, onChange, className, rows = 3 }: Omit<TextProps, "inputProps"> & { rows?: number }) {
  const errors = useFieldErrors(path);
  return (
    <Field id={fieldDomId(path)} label={label} hint={hint} error={errors} className={className}>
      {(p) => <Textarea {...p} rows={rows} value={value} onChange={(e) => onChange(e.target.value)} />}
    </Field>
  );
}

export function SelectField<T extends string>({
  path,
  label,
  hint,
  value,
  onChange,
  options,
  className,
  placeholder,
}: {
  path: string;
  label: ReactNode;
  hint?: ReactNode;
  value: T | "";
  onChange: (value: T) => void;
  options: readonly { value: T; label: string }[];
  className?: string;
  placeholder?: string;
}) {
  const errors = useFieldErrors(path);
  const known = options.some((o) => o.value === value);
  return (
    <Field id={fieldDomId(path)} label={label} hint={hint} error={errors} className={className}>
      {(p) => (
        <Select {...p} value={value} onChange={(e) => onChange(e.target.value as T)}>
          {!known ? <option value={value}>{placeholder ?? "Choose…"}</option> : null}
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </Select>
      )}
    </Field>
  );
}

/**
 * A number typed as text. The text stays exactly as typed ("0." or "1e-3" halfway through);
 * the stored value follows it: null when blank, NaN when it is not a number (the schema then
 * puts its message at this field). When the value changes from outside, the text follows.
 */
export function NumberField({
  path,
  label,
  hint,
  value,
  onChange,
  className,
  unit,
  placeholder,
}: {
  path: string;
  label: ReactNode;
  hint?: ReactNode;
  value: number | null | undefined;
  onChange: (value: number | null) => void;
  className?: string;
  unit?: string;
  placeholder?: string;
}) {
  const errors = useFieldErrors(path);
  const [text, setText] = useState(formatStoredNumber(value));
  const [seen, setSeen] = useState(value);
  if (!Object.is(seen, value)) {
    setSeen(value);
    if (!textMatchesValue(text, value)) setText(formatStoredNumber(value));
  }
  const parsed = parseTypedNumber(text);
  const localError = parsed !== null && Number.isNaN(parsed) ? ["Type a number, for example 0.5 or 1.2e-3."] : undefined;
  const shown = errors ?? localError;
  return (
    <Field id={fieldDomId(path)} label={label} hint={hint} error={shown} className={className}>
      {(p) => (
        <div className="flex items-center gap-2">
          <Input
            {...p}
            inputMode="decimal"
            autoComplete="off"
           
            placeholder={placeholder}
            value={text}
            onChange={(e) => {
              const next = e.target.value;
              setText(next);
              const n = parseTypedNumber(next);
              setSeen(n);
              onChange(n);
            }}
          />
          {unit ? <span className="shrink-0 text-muted">{unit}</span> : null}
        </div>
      )}
    </Field>
  );
}

export function CheckboxField({ id, label, hint, checked, onChange }: { id: string; label: ReactNode; hint?: ReactNode; checked: boolean; onChange: (checked: boolean) => void }) {
  return (
    <label htmlFor={id} className="flex min-h-11 cursor-pointer items-start gap-3 rounded-md py-1">
      <input id={id} type="checkbox" className="mt-1 size-5 shrink-0 accent-brand" checked={checked} onChange={(e) => onChange(e.target.checked)} />
      <span>
        <span className="block font-semibold">{label}</span>
        {hint ? <span className="block text-sm text-muted">{hint}</span> : null}
      </span>
    </label>
  );
}

/** A group of choices (radio buttons or checkboxes) with a legend and the errors for its path. */
export function ChoiceGroup({ path, legend, hint, children, className }: { path: string; legend: ReactNode; hint?: ReactNode; children: ReactNode; className?: string }) {
  const errors = useFieldErrors(path);
  const id = fieldDomId(path);
  return (
    <fieldset id={id} tabIndex={-1} className={cn("flex flex-col gap-1", className)} aria-describedby={[hint ? `${id}-hint` : "", errors ? `${id}-error` : ""].filter(Boolean).join(" ") || undefined}>
      <legend className="mb-1 font-semibold">{legend}</legend>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
      {children}
      <div aria-live="polite">
        {errors ? (
          <p id={`${id}-error`} className="text-sm font-semibold text-bad">
            {errors.join(" ")}
          </p>
        ) : null}
      </div>
    </fieldset>
  );
}

/** Errors for a path that has no single control (a list, a card): shown as a line. */
export function PathErrors({ path, className }: { path: string; className?: string }) {
  const errors = useFieldErrors(path);
  if (!errors) return null;
  return (
    <p id={`${fieldDomId(path)}-error`} className={cn("text-sm font-semibold text-bad", className)}>
      {errors.join(" ")}
    </p>
  );
}
