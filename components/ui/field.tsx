import { useId } from "react";

type FieldProps = {
  /** A stable id, for a field another element points at (a message elsewhere on the page, a test); useId() otherwise. */
  id?: string;
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
  placeholder?: string;
  /** The length bound the schema behind the form enforces too. */
  maxLength?: number;
  inputMode?: "decimal" | "numeric" | "text";
  /** Figures in the data face (serials, numbers). */
  figure?: boolean;
  /** The id of a message shown elsewhere (e.g. a notice above the form) that also describes this field and marks it invalid. */
  messageId?: string;
};

export const selectClass = "w-full rounded border border-rule-strong bg-paper-bright px-3 py-2 text-base text-ink";
const inputClass = `${selectClass} placeholder:text-ink-muted read-only:bg-paper-deep aria-[invalid=true]:border-signal`;

/** Label above, hint and error below, wired with aria-describedby so a screen reader hears both. */
export function Field(props: FieldProps) {
  const { label, name, type = "text", autoComplete, defaultValue, hint, error, required, readOnly, value, onChange, placeholder, maxLength, inputMode, figure, messageId } = props;
  const generatedId = useId();
  const id = props.id ?? generatedId;
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const invalid = Boolean(error || messageId);
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
        placeholder={placeholder}
        maxLength={maxLength}
        inputMode={inputMode}
        aria-invalid={invalid ? true : undefined}
        aria-describedby={[hintId, messageId, errorId].filter(Boolean).join(" ") || undefined}
        className={figure ? `${inputClass} figure` : inputClass}
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
