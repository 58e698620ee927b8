import "server-only";
import { Image, Text, View } from "@react-pdf/renderer";
import { hasDesignData } from "../../sheet/design-data";
import type { SheetModel } from "../../sheet/types";
import { PdfTable, SectionHeading, styles } from "./pdf-parts";

/** Largest drawing on the page, in points: the text column's width, and a third of an A4 page's height. */
const OUTLINE_MAX_WIDTH_PT = 400;
const OUTLINE_MAX_HEIGHT_PT = 280;

/** Package outline, pin functions, recommended operating conditions and ordering information, as the web sheet's SheetDesignIn. */
export function PdfDesignIn({ model }: { model: SheetModel }) {
  const data = model.designData;
  if (!hasDesignData(data)) return null;
  const outline = data.packageOutline;
  const scale = outline ? Math.min(OUTLINE_MAX_WIDTH_PT / outline.widthPx, OUTLINE_MAX_HEIGHT_PT / outline.heightPx, 1) : 1;
  return (
    <View>
      {data.recommendedOperatingConditions.length ? (
        <View wrap={false}>
          <SectionHeading>Recommended operating conditions</SectionHeading>
          <PdfTable
            columns={[
              { header: "Parameter", width: "46%" },
              { header: "Min", width: "13%", align: "right", mono: true },
              { header: "Typ", width: "13%", align: "right", mono: true },
              { header: "Max", width: "13%", align: "right", mono: true },
              { header: "Unit", width: "15%" },
            ]}
            rows={data.recommendedOperatingConditions.map((c) => [c.parameter, c.min.text, c.typ.text, c.max.text, c.unit])}
          />
        </View>
      ) : null}
      {outline ? (
        <View wrap={false}>
          <SectionHeading>Package outline</SectionHeading>
          <Image src={{ data: Buffer.from(outline.dataUri.slice(outline.dataUri.indexOf(",") + 1), "base64"), format: "png" }} style={{ width: outline.widthPx * scale, height: outline.heightPx * scale }} />
          {outline.caption ? <Text style={styles.small}>{outline.caption}</Text> : null}
        </View>
      ) : null}
      {data.pinFunctions.length ? (
        <View wrap={false}>
          <SectionHeading>Pin functions</SectionHeading>
          <PdfTable
            columns={[
              { header: "Pin", width: "12%", mono: true },
              { header: "Name", width: "18%" },
              { header: "Function", width: "70%" },
            ]}
            rows={data.pinFunctions.map((p) => [p.pin, p.name, p.function])}
          />
        </View>
      ) : null}
      {data.ordering.length ? (
        <View wrap={false}>
          <SectionHeading>Ordering information</SectionHeading>
          <PdfTable
            columns={[
              { header: "Part number", width: "30%", mono: true },
              { header: "Options", width: "40%" },
              { header: "Packing", width: "30%" },
            ]}
            rows={data.ordering.map((o) => [o.partNumber, o.options, o.packing])}
          />
        </View>
      ) : null}
    </View>
  );
}
