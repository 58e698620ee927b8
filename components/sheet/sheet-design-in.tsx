import { hasDesignData } from "@/lib/sheet/design-data";
import type { SheetModel } from "@/lib/sheet/types";
import { RuledTable } from "@/components/ui/ruled-table";
import { SheetHeading } from "./sheet-heading";

/** Package outline, pin functions, recommended operating conditions and ordering information: what a designer needs beside the table. */
export function SheetDesignIn({ model }: { model: SheetModel }) {
  const data = model.designData;
  if (!hasDesignData(data)) return null;
  const outline = data.packageOutline;
  return (
    <>
      {data.recommendedOperatingConditions.length ? (
        <section aria-labelledby="sheet-operating-conditions" className="sheet-keep mt-10">
          <SheetHeading id="sheet-operating-conditions">Recommended operating conditions</SheetHeading>
          <RuledTable
            className="max-w-2xl"
            columns={[
              { head: "Parameter", rowHeader: true },
              { head: "Min", numeric: true, cellClassName: "figure" },
              { head: "Typ", numeric: true, cellClassName: "figure" },
              { head: "Max", numeric: true, cellClassName: "figure" },
              { head: "Unit", cellClassName: "unit" },
            ]}
            rows={data.recommendedOperatingConditions.map((c, i) => ({ key: `${c.parameter}-${i}`, cells: [c.parameter, c.min.text, c.typ.text, c.max.text, c.unit] }))}
          />
        </section>
      ) : null}
      {outline ? (
        <section aria-labelledby="sheet-package-outline" className="sheet-keep mt-10">
          <SheetHeading id="sheet-package-outline">Package outline</SheetHeading>
          <figure className="max-w-2xl">
            {/* The drawing travels in the frozen model as a PNG data URI; next/image adds nothing to one. */}
            <img
              src={outline.dataUri}
              width={outline.widthPx}
              height={outline.heightPx}
              alt={outline.caption ? `Package outline: ${outline.caption}` : `Package outline of ${model.header.partNumber}`}
              className="h-auto max-h-[28rem] w-auto max-w-full border border-rule bg-white"
            />
            {outline.caption ? <figcaption className="mt-1 text-sm text-ink-muted">{outline.caption}</figcaption> : null}
          </figure>
        </section>
      ) : null}
      {data.pinFunctions.length ? (
        <section aria-labelledby="sheet-pin-functions" className="sheet-keep mt-10">
          <SheetHeading id="sheet-pin-functions">Pin functions</SheetHeading>
          <RuledTable
            className="max-w-2xl"
            columns={[{ head: "Pin", cellClassName: "figure" }, { head: "Name", rowHeader: true }, { head: "Function" }]}
            rows={data.pinFunctions.map((p, i) => ({ key: `${p.pin}-${p.name}-${i}`, cells: [p.pin, p.name, p.function] }))}
          />
        </section>
      ) : null}
      {data.ordering.length ? (
        <section aria-labelledby="sheet-ordering" className="sheet-keep mt-10">
          <SheetHeading id="sheet-ordering">Ordering information</SheetHeading>
          <RuledTable
            className="max-w-2xl"
            columns={[{ head: "Part number", rowHeader: true, cellClassName: "figure" }, { head: "Options" }, { head: "Packing" }]}
            rows={data.ordering.map((o, i) => ({ key: `${o.partNumber}-${i}`, cells: [o.partNumber, o.options, o.packing] }))}
          />
        </section>
      ) : null}
    </>
  );
}
