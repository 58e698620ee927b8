import { attachesToNumber, quantityParts, rangeParts, type QuantityStyle } from "@/lib/format";

type QuantityProps = { value: string; unit?: string; className?: string };

/** A figure and its unit, joined by a no-break space so a line never separates them ("90°" and "1.5:1" take none). */
export function Quantity({ value, unit, className }: QuantityProps) {
  return (
    <span className={`whitespace-nowrap ${className ?? ""}`}>
      <span className="figure">{value}</span>
      {unit ? (
        <>
          {attachesToNumber(unit) ? null : "\u00a0"}
          <span className="unit">{unit}</span>
        </>
      ) : null}
    </span>
  );
}

/** A number with its unit through the one formatter (lib/format): prefix, digits, true minus. */
export function NumberQuantity({ value, unit = "", ...style }: { value: number; unit?: string } & QuantityStyle) {
  return <Quantity {...quantityParts(value, unit, style)} />;
}

/** A range with its unit once: "0.2–2 GHz". */
export function RangeQuantity({ min, max, unit, ...style }: { min: number; max: number; unit: string } & QuantityStyle) {
  return <Quantity {...rangeParts(min, max, unit, style)} />;
}
