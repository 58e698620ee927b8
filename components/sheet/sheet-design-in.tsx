import { hasDesignData } from "@/lib/sheet/design-data";
import type { SheetModel } from "@/lib/sheet/types";
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
          <table className="sheet-table max-w-2xl">
            <thead>
              <tr>
                <th scope="col">Parameter</th>
                <th scope="col" className="num">Min</th>
                <th scope="col" className="num">Typ</th>
                <th scope="col" className="num">Max</th>
                <th scope="col">Unit</th>
              </tr>
            </thead>
            <tbody>
              {data.recommendedOperatingConditions.map((c, i) => (
                <tr key={`${c.parameter}-${i}`}>
                  <th scope="row">{c.parameter}</th>
                  <td className="num figure">{c.min.text}</td>
                  <td className="num figure">{c.typ.text}</td>
                  <td className="num figure">{c.max.text}</td>
                  <td className="unit">{c.unit}</td>
                </tr>
              ))}
            </tbody>
          </table>
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
          <table className="sheet-table max-w-2xl">
            <thead>
              <tr>
                <th scope="col">Pin</th>
                <th scope="col">Name</th>
                <th scope="col">Function</th>
              </tr>
            </thead>
            <tbody>
              {data.pinFunctions.map((p, i) => (
                <tr key={`${p.pin}-${p.name}-${i}`}>
                  <td className="figure">{p.pin}</td>
                  <th scope="row">{p.name}</th>
                  <td>{p.function}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ) : null}
      {data.ordering.length ? (
        <section aria-labelledby="sheet-ordering" className="sheet-keep mt-10">
          <SheetHeading id="sheet-ordering">Ordering information</SheetHeading>
          <table className="sheet-table max-w-2xl">
            <thead>
              <tr>
                <th scope="col">Part number</th>
                <th scope="col">Options</th>
                <th scope="col">Packing</th>
              </tr>
            </thead>
            <tbody>
              {data.ordering.map((o, i) => (
                <tr key={`${o.partNumber}-${i}`}>
                  <th scope="row" className="figure">{o.partNumber}</th>
                  <td>{o.options}</td>
                  <td>{o.packing}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ) : null}
    </>
  );
}
