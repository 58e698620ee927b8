import { formatNumber } from "@/components/format-quantity";

type QuantityProps = { value: string; unit?: string; className?: string };

/** A figure and its unit, joined by a no-break space so a line never separates them. */
export function Quantity({ value, unit, className }: QuantityProps) {
  return (
    <span className={`whitespace-nowrap ${className ?? ""}`}>
      <span className="figure">{value}</span>
      {unit ? (
        <>
          {"\u00a0"}
          <span className="unit">{unit}</span>
        </>
      ) : null}
    </span>
  );
}

export function NumberQuantity({ value, unit, signed }: { value: number; unit?: string; signed?: boolean }) {
  return <Quantity value={formatNumber(value, { signed })} unit={unit} />;
}
