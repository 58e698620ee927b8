/**
 * The reason a recorded action asks for (withdrawing a revision, closing a conformity alert):
 * a labelled textarea of 10–2000 characters with its error below, wired by aria-describedby.
 */
import { selectClass } from "./field";

/** `rows` is the textarea's height (3 by default; the review decision asks for a longer reason and gives 4). */
export function ReasonField({ id, label, error, placeholder, rows = 3 }: { id: string; label: string; error?: string; placeholder?: string; rows?: number }) {
  return (
    <>
      <label htmlFor={`${id}-reason`} className="block text-[0.8125rem] font-semibold">
        {label}
      </label>
      <textarea
        id={`${id}-reason`}
        name="reason"
        rows={rows}
        required
        minLength={10}
        maxLength={2000}
        placeholder={placeholder}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-reason-error` : undefined}
        className={`${selectClass} text-[0.875rem]`}
      />
      {error ? (
        <p id={`${id}-reason-error`} className="text-sm text-signal-deep">
          {error}
        </p>
      ) : null}
    </>
  );
}
