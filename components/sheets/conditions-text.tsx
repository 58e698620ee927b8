/** A model's conditions text with the templates' "T_A" notation set as a subscript, as the sheet prints it. */
export function ConditionsText({ text }: { text: string }) {
  const parts = text.split(/\b([A-Za-z]+)_([A-Za-z0-9]+)\b/);
  const out: React.ReactNode[] = [];
  for (let i = 0; i < parts.length; i += 3) {
    if (parts[i]) out.push(parts[i]);
    if (parts[i + 1] !== undefined) {
      out.push(
        <span key={i} className="whitespace-nowrap">
          {parts[i + 1]}
          <sub>{parts[i + 2]}</sub>
        </span>,
      );
    }
  }
  return <>{out}</>;
}
