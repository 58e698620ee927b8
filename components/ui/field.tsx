import { useId } from "react";

type FieldProps = {
  label: string;
  name: string;
  type?: string;
  autoComplete?: string;
  defaultValue?: string;
  hint?: string;
  error?: string;
  required?: boolean;
  readOnly?: boolean;
  value?: string;
  onChange?: (value: string) => void;
};

export const selectClass = "w-full rounded border border-rule-strong bg-paper-bright px-3 py-2 text-base text-ink";
const inputClass = `${selectClass} placeholder:text-ink-muted read-only:bg-paper-deep aria-[invalid=true]:border-signal`;

/** Label above, hint and error below, wired with aria-describedby so a screen reader hears both. */
export function Field({ label, name, type = "text", autoComplete, defaultValue, hint, error, required, readOnly, value, onChange }: FieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-[0.9375rem] font-semibold">
        {label}
      </label>
      <input
        id={id}
        name={name}
        type={type}
        autoComplete={autoComplete}
        defaultValue={value === undefined ? defaultValue : undefined}
        value={value}
        onChange={onChange ? (e) => onChange(e.target.value) : undefined}
        required={required}
        readOnly={readOnly}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(" ") || undefined}
        className={inputClass}
      />
      {hint ? (
        <p id={hintId} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} className="text-sm text-signal-deep">
          {error}
        </p>
      ) : null}
    </div>
  );
}
