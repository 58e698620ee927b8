import { notationSegments } from "@/lib/sheet/notation";

/** A model string in the sheet's notation, "T_A" set as T with a subscript A (lib/sheet/notation.ts). */
export function Notation({ text }: { text: string }) {
  return (
    <>
      {notationSegments(text).map((segment, i) =>
        segment.sub === undefined ? (
          segment.text
        ) : (
          <span key={i} className="whitespace-nowrap">
            {segment.text}
            <sub>{segment.sub}</sub>
          </span>
        ),
      )}
    </>
  );
}
