import "server-only";
import { Document, Font, Image, Link, Page, renderToBuffer, Text, View } from "@react-pdf/renderer";
import type { ReactNode } from "react";
import type { SheetModel, SheetSignature, StatisticsGroup } from "../../sheet/types";
import { fontFiles, MONO_FAMILY, SANS_FAMILY } from "./fonts";
import { type Cell, colors, type Column, PdfNotation, PdfProse, PdfTable, SectionHeading, styles } from "./pdf-parts";
import { CHART_PNG_SCALE, renderSheetChartPngs } from "../charts/render-chart";
import { A4_HEIGHT_PT, A4_WIDTH_PT, FIGURE_COLUMN_PT, PAGE_MARGIN_PT, printedFigureWidthPt } from "../../sheet/print-figure";
import { settleGlyphCodePoints } from "./settle-glyph-code-points";
import { stampPageNumbers } from "./stamp-page-numbers";
import { PdfDesignIn } from "./pdf-design-in";
import { proseLayout } from "../../sheet/prose-layout";
import { annexUnitText, describeAbsentCpk, formatCpkInterval, formatPassCount } from "../../sheet/format";
import { candidateDigestLabel, signedAtText } from "../../sheet/release-text";

let fontsRegistered = false;

function registerFonts(): void {
  if (fontsRegistered) return;
  Font.register({
    family: SANS_FAMILY,
    fonts: [
      { src: fontFiles.sansRegular, fontWeight: 400 },
      { src: fontFiles.sansItalic, fontWeight: 400, fontStyle: "italic" },
      { src: fontFiles.sansSemiBold, fontWeight: 600 },
      { src: fontFiles.sansBold, fontWeight: 700 },
    ],
  });
  Font.register({
    family: MONO_FAMILY,
    fonts: [
      { src: fontFiles.monoRegular, fontWeight: 400 },
      { src: fontFiles.monoSemiBold, fontWeight: 600 },
    ],
  });
  // Part numbers, units and serials must never be split by an invented hyphen.
  Font.registerHyphenationCallback((word) => [word]);
  fontsRegistered = true;
}

/** The sheet model as a paginated A4 PDF: the same content as the web view, charts from the same Vega-Lite specs. */
export async function renderSheetPdf(model: SheetModel): Promise<Buffer> {
  registerFonts();
  await settleGlyphCodePoints();
  const charts = await renderSheetChartPngs(model);
  const pdf = await renderToBuffer(<SheetDocument model={model} charts={charts} />);
  // In the running foot's line, flush with its right edge (see RunningFoot).
  return stampPageNumbers(pdf, {
    right: A4_WIDTH_PT - PAGE_MARGIN,
    baseline: FOOT_BASELINE_FROM_BOTTOM + footLift(model),
    size: BAND_FONT_SIZE,
    color: colors["ink-muted"],
    fontFile: fontFiles.sansRegular,
    fontName: "SourceSans3-Regular",
  });
}

const PAGE_MARGIN = PAGE_MARGIN_PT;

/**
 * One A4 page sequence with the running head and foot and, until release, the diagonal mark.
 * The sheet is four sequences (front matter; ratings, cautions and charts; prose and
 * traceability; annex), each starting a new page: react-pdf lays out what is left of a sequence again at every page break, so one
 * long sequence cost about twice the time of these shorter ones. "Page x of y" counts across all.
 */
function SheetPage({ model, children }: { model: SheetModel; children: ReactNode }) {
  return (
    <Page
      size="A4"
      style={{
        fontFamily: SANS_FAMILY,
        // No ligatures: a part number such as "KDX-ff1" or a word like "offset" must copy and search
        // as the letters it is made of, not as U+FB00 "ﬀ" (Source Sans 3 ligates ff, fi, fl by default).
        fontFeatureSettings: { liga: false },
        fontSize: 8.8,
        lineHeight: 1.35,
        color: colors.ink,
        paddingTop: 56,
        paddingBottom: 50 + footLift(model),
        paddingHorizontal: PAGE_MARGIN,
        backgroundColor: "#FFFFFF",
      }}
    >
      {model.header.banner ? <Watermark text={model.header.banner} /> : null}
      <RunningHead model={model} />
      <RunningFoot model={model} />
      {children}
    </Page>
  );
}
const FOOT_TOP = A4_HEIGHT_PT - 40;
/** The running head's and foot's text, and the page number stamped into the foot. */
const BAND_FONT_SIZE = 7.5;
// The foot's line sits 4 pt below its rule; its baseline, measured with pdftotext -bbox against
// react-pdf's own text in that line, is 27.8 pt above the page's bottom edge.
const FOOT_BASELINE_FROM_BOTTOM = 27.8;
/** About one band line (BAND_FONT_SIZE at the page's line height, 1.35): how far a released sheet's foot rises. */
const BAND_LINE = 10.2;

/**
 * A released sheet's foot has a second line, the verification reference, below the first; the
 * whole foot (and the body's bottom edge) rises by one line so that line keeps clear of a printer's margin.
 */
function footLift(model: SheetModel): number {
  return model.release ? BAND_LINE : 0;
}

function SheetDocument({ model, charts }: { model: SheetModel; charts: Record<string, Buffer> }) {
  const { header } = model;
  const { description, features, later: laterProse } = proseLayout(model.prose);
  return (
    <Document
      title={`${header.partNumber} ${header.title} (${header.revisionText})`}
      author={header.organizationName}
      subject={`${header.deviceClassLabel} characterization sheet`}
      creator="Benchfold"
      producer="Benchfold"
      language="en"
    >
      <SheetPage model={model}>
        <TitleBlock model={model} />

        <View style={{ flexDirection: "row", marginTop: 10 }}>
          <View style={{ flex: 3, paddingRight: 16 }}>
            <SectionHeading>{description?.title ?? "Description"}</SectionHeading>
            {description ? <PdfProse blocks={description.blocks} /> : null}
          </View>
          <View style={{ flex: 2 }}>
            <SectionHeading>{features?.title ?? "Key features"}</SectionHeading>
            {features ? <PdfProse blocks={features.blocks} /> : null}
          </View>
        </View>

        <SpecificationsTable model={model} />
        {model.charts.length === 0 ? (
          <>
            <AbsoluteMaximumRatings model={model} />
            <Cautions model={model} />
            <PdfDesignIn model={model} />
          </>
        ) : null}
      </SheetPage>

      {/* Ratings and cautions open the charts' page sequence: one sequence carrying both the long
          specification table and the charts cost 15 % more to lay out. */}
      {model.charts.length > 0 ? (
        <SheetPage model={model}>
          <AbsoluteMaximumRatings model={model} />
          <Cautions model={model} />
          <PdfDesignIn model={model} />
          <View>
            <SectionHeading>Typical performance</SectionHeading>
            {/* Two figures a row, each printed at the size it was drawn (lib/sheet/print-figure.ts). */}
            <View style={{ flexDirection: "row", flexWrap: "wrap", justifyContent: "space-between" }}>
              {model.charts.map((chart, i) => (
                <PdfFigure key={chart.id} number={i + 1} title={chart.title} caption={chart.caption} png={charts[chart.id]} />
              ))}
            </View>
          </View>
        </SheetPage>
      ) : null}

      <SheetPage model={model}>
        {laterProse.map((section) => (
          <View key={section.id}>
            <SectionHeading>{section.title}</SectionHeading>
            <PdfProse blocks={section.blocks} />
          </View>
        ))}
        <Traceability model={model} />
      </SheetPage>

      <SheetPage model={model}>
        <StatisticsAnnex model={model} />
        <RevisionHistory model={model} />
        <ReleaseRecord model={model} />
        {!header.released && (model.issues.length > 0 || (model.reviewChecks ?? []).length > 0) ? (
          <View>
            <SectionHeading>Review notes (not printed on a released sheet)</SectionHeading>
            {model.issues.length === 0 ? <Text style={styles.paragraph}>No open issue.</Text> : null}
            {model.issues.map((issue, i) => (
              <Text key={i} style={styles.paragraph}>
                • {issue.message}
              </Text>
            ))}
            {(model.reviewChecks ?? []).map((text, i) => (
              <Text key={`check-${i}`} style={[styles.paragraph, { color: colors["ink-muted"] }]}>
                {text}
              </Text>
            ))}
          </View>
        ) : null}
      </SheetPage>
    </Document>
  );
}

function PdfFigure({ number, title, caption, png }: { number: number; title: string; caption: string; png: Buffer | undefined }) {
  // The PNG is drawn at CHART_PNG_SCALE pixels a point; its IHDR holds its size (ISO/IEC 15948 §11.2.2).
  const drawn = png ? { width: png.readUInt32BE(16) / CHART_PNG_SCALE, height: png.readUInt32BE(20) / CHART_PNG_SCALE } : null;
  const width = drawn ? printedFigureWidthPt(drawn.width) : FIGURE_COLUMN_PT;
  return (
    <View wrap={false} style={{ width: FIGURE_COLUMN_PT, marginBottom: 10 }}>
      <Text style={{ fontWeight: 600, marginBottom: 2 }}>
        Figure {number}. {title}
      </Text>
      {png && drawn ? <Image src={{ data: png, format: "png" }} style={{ width, height: (drawn.height * width) / drawn.width }} /> : null}
      <Text style={styles.small}>{caption}</Text>
    </View>
  );
}

function Watermark({ text }: { text: string }) {
  return (
    <View fixed style={{ position: "absolute", top: 0, left: 0, right: 0, bottom: 0, alignItems: "center", justifyContent: "center" }}>
      <Text
        style={{
          fontSize: 44,
          fontWeight: 700,
          letterSpacing: 2,
          color: colors.signal,
          opacity: 0.14,
          transform: "rotate(-45deg)",
          width: 760,
          textAlign: "center",
        }}
      >
        {text}
      </Text>
    </View>
  );
}

/**
 * A fixed line of small muted text across every page between the margins, ruled off from the
 * body: the running head above it, the running foot below it.
 */
function RunningBand({ edge, lift = 0, children }: { edge: "head" | "foot"; lift?: number; children: ReactNode }) {
  const rule =
    edge === "head"
      ? { borderBottomWidth: 0.5, borderBottomColor: colors.rule, paddingBottom: 4 }
      : { borderTopWidth: 0.5, borderTopColor: colors.rule, paddingTop: 4 };
  return (
    <View
      fixed
      style={{
        position: "absolute",
        // The foot is placed from the top too: a bottom-anchored fixed view vanished from this layout in react-pdf 4.9.
        top: edge === "head" ? 22 : FOOT_TOP - lift,
        // The head is one line, split left and right; the foot is a column of lines (the page number is stamped into its first).
        ...(edge === "head" ? { flexDirection: "row" as const, justifyContent: "space-between" as const } : { flexDirection: "column" as const }),
        left: PAGE_MARGIN,
        right: PAGE_MARGIN,
        ...rule,
        fontSize: BAND_FONT_SIZE,
        color: colors["ink-muted"],
      }}
    >
      {children}
    </View>
  );
}

function RunningHead({ model }: { model: SheetModel }) {
  const { header } = model;
  return (
    <RunningBand edge="head">
      <Text>
        <Text style={{ fontWeight: 600, color: colors.ink }}>{header.partNumber}</Text> · {header.deviceClassLabel}
      </Text>
      <Text>
        <Text style={header.released ? { fontWeight: 600, color: colors.ink } : {}}>{header.revisionText}</Text>
        {header.released ? " · released " : " · "}
        {header.date}
        {header.banner ? <Text style={{ color: colors.signal, fontWeight: 600 }}> · {header.stateLabel}</Text> : null}
      </Text>
    </RunningBand>
  );
}

function RunningFoot({ model }: { model: SheetModel }) {
  const { header, release } = model;
  return (
    <RunningBand edge="foot" lift={footLift(model)}>
      {/* "Page k of N" is stamped at the right end of the first line after layout (stampPageNumbers). */}
      <Text>
        {header.organizationName} · {header.partNumber} <Text style={header.released ? { fontWeight: 600, color: colors.ink } : {}}>{header.revisionText}</Text>
      </Text>
      {release ? (
        <Text>
          Verify: <Text style={{ fontFamily: MONO_FAMILY, color: colors.ink }}>{release.verificationReference}</Text> at{" "}
          <Link src={release.verificationUrl} style={{ color: colors["ink-muted"], textDecoration: "none" }}>
            {release.verificationUrl}
          </Link>
        </Text>
      ) : null}
    </RunningBand>
  );
}

function TitleBlock({ model }: { model: SheetModel }) {
  const { header, keyFacts } = model;
  return (
    <View>
      <Text style={{ fontSize: 7.5, fontWeight: 600, letterSpacing: 1, textTransform: "uppercase", color: colors["ink-muted"] }}>
        Characterization sheet · {header.deviceClassLabel}
      </Text>
      <Text style={{ fontSize: 24, lineHeight: 1.15, fontWeight: 600, marginTop: 4, letterSpacing: -0.2 }}>{header.partNumber}</Text>
      <Text style={{ fontSize: 12.5, lineHeight: 1.25, marginTop: 2 }}>{header.title}</Text>
      <Text style={{ marginTop: 4, color: colors["ink-muted"] }}>
        {header.organizationName} · {header.revisionText} · {header.stateLabel} · {header.date}
      </Text>
      {header.banner ? (
        <View style={{ marginTop: 8, padding: 6, borderWidth: 1, borderColor: colors.signal, backgroundColor: colors["signal-wash"] }}>
          <Text style={{ color: colors.signal, fontWeight: 700, letterSpacing: 0.8 }}>{header.banner}</Text>
          <Text style={{ fontSize: 7.8 }}>
            This revision is {header.stateLabel.toLowerCase()}. Figures may change before release; do not design in from this sheet.
          </Text>
        </View>
      ) : null}
      {keyFacts.length > 0 ? (
        <View style={{ flexDirection: "row", marginTop: 10, borderTopWidth: 1.2, borderTopColor: colors.ink, paddingTop: 5 }}>
          {keyFacts.map((fact) => (
            <View key={fact.label} style={{ flex: 1, paddingRight: 8 }}>
              <Text style={styles.small}>{fact.label}</Text>
              <Text>
                <Text style={{ fontFamily: MONO_FAMILY, fontSize: 10.5, lineHeight: 1.3 }}>{fact.value}</Text>
                {fact.unit ? <Text style={{ color: colors["ink-muted"] }}> {fact.unit}</Text> : null}
              </Text>
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}

function SpecificationsTable({ model }: { model: SheetModel }) {
  const { specifications } = model;
  // Each condition column is as wide as the longest word it must hold on one line (a value and its unit are one
  // word, joined by a no-break space) at the cell's type size, plus the cell's padding: a narrower box and react-pdf
  // breaks the word with a hyphen ("0.5–3 -", "70 -"). Together they take 34 % of the width or what they need up to
  // 46 %, the rest from the Parameter column, whose names wrap at spaces; beyond 46 % they share it by their needs.
  const longestWord = (text: string) => Math.max(0, ...text.split(/[ \n]+/).map((word) => word.length));
  const conditionChars = specifications.conditionColumns.map((c, i) =>
    Math.max(3, longestWord(c.label), ...specifications.rows.map((r) => longestWord(r.conditions[i] ?? ""))),
  );
  const tableWidthPt = A4_WIDTH_PT - 2 * PAGE_MARGIN;
  // 0.52 em a character of the 7.8 pt cell type (common practice for a proportional sans serif's digits and units), 4 pt padding and 2 pt to spare.
  const neededPercent = conditionChars.map((chars) => (100 * (chars * 0.52 * 7.8 + 6)) / tableWidthPt);
  const neededTotal = neededPercent.reduce((sum, n) => sum + n, 0);
  const conditionsShare = Math.min(46, Math.max(34, neededTotal));
  const percent = (n: number): `${number}%` => `${Math.floor(n * 100) / 100}%`;
  const columns: Column[] = [
    { header: "Parameter", width: percent(22 - (conditionsShare - 34)) },
    { header: "Symbol", width: "7%" },
    ...specifications.conditionColumns.map((c, i): Column => ({ header: c.label, width: percent((conditionsShare * neededPercent[i]) / neededTotal) })),
    { header: "Min", width: "7%", align: "right", mono: true },
    { header: "Typ", width: "7.5%", align: "right", mono: true },
    { header: "Max", width: "7.5%", align: "right", mono: true },
    { header: "Unit", width: "8%" },
    { header: "Basis", width: "5%" },
  ];
  const rows = specifications.rows.map((row): Cell[] => [
    <>
      {row.label}
      {row.footnoteMarks.length > 0 ? <Text style={{ fontSize: 5.8, color: colors["ink-muted"], verticalAlign: "super" }}> {row.footnoteMarks.join(",")}</Text> : null}
      {!row.supported ? <Text style={{ color: colors.signal, fontWeight: 700 }}> !</Text> : null}
    </>,
    <PdfNotation text={row.symbol} />,
    ...row.conditions,
    row.min.text,
    row.typIsMeasuredMean ? <Text style={{ color: colors["ink-muted"] }}>{row.typ.text}</Text> : row.typ.text,
    row.max.text,
    row.unit,
    row.basisMark,
  ]);
  return (
    <View>
      <SectionHeading>Electrical specifications</SectionHeading>
      {rows.length === 0 && model.noDataNotice ? <PdfNoDataNotice text={model.noDataNotice} /> : <PdfTable columns={columns} rows={rows} />}
      <View style={{ marginTop: 4 }}>
        {specifications.notes.map((note, i) => (
          <Text key={i} style={styles.small}>
            <PdfNotation text={note} subSize={5.4} />
          </Text>
        ))}
        <Text style={[styles.small, { marginTop: 3 }]}>
          Basis: {specifications.basisLegend.map((entry) => `${entry.mark} ${entry.text}`).join("  ")}
        </Text>
        {specifications.footnotes.map((footnote) => (
          <Text key={footnote.mark} style={styles.small}>
            {footnote.mark}. {footnote.text}
          </Text>
        ))}
        {specifications.rows.some((row) => !row.supported) ? (
          <Text style={[styles.small, { color: colors.signal }]}>! The data do not support this limit: see the statistics annex.</Text>
        ) : null}
      </View>
    </View>
  );
}

function AbsoluteMaximumRatings({ model }: { model: SheetModel }) {
  return (
    <View wrap={false}>
      <SectionHeading>Absolute maximum ratings</SectionHeading>
      <PdfTable
        columns={[
          { header: "Rating", width: "62%" },
          { header: "Value", width: "24%", align: "right", mono: true },
          { header: "Unit", width: "14%" },
        ]}
        rows={model.absoluteMaximumRatings.map((rating) => [
          rating.label,
          rating.missing ? <Text style={{ color: colors.signal }}>to be stated</Text> : rating.value,
          rating.unit,
        ])}
      />
    </View>
  );
}

function Cautions({ model }: { model: SheetModel }) {
  return (
    <View>
      <SectionHeading>Cautions</SectionHeading>
      {model.cautions.map((caution, i) => (
        <View key={i} style={styles.listItem} wrap={false}>
          <Text style={styles.bullet}>{i + 1}.</Text>
          <Text style={{ flex: 1 }}>{caution}</Text>
        </View>
      ))}
    </View>
  );
}

function Traceability({ model }: { model: SheetModel }) {
  const { traceability } = model;
  return (
    <View>
      <SectionHeading>Measurement traceability</SectionHeading>
      {traceability.statements.map((statement, i) => (
        <Text key={i} style={styles.paragraph}>
          {statement}
        </Text>
      ))}
      {model.noDataNotice ? (
        <PdfNoDataNotice text={model.noDataNotice} />
      ) : (
        <>
          <Text style={styles.subHeading}>Instruments</Text>
          <PdfTable
            columns={[
              { header: "Instrument", width: "20%" },
              { header: "Model", width: "15%" },
              { header: "Serial", width: "11%", mono: true },
              { header: "Calibrated", width: "11%", mono: true },
              { header: "Due", width: "11%", mono: true },
              { header: "Stated uncertainty", width: "26%" },
              { header: "Sets", width: "6%", align: "right", mono: true },
            ]}
            rows={traceability.instruments.map((instrument) => [
              instrument.kind,
              instrument.model,
              instrument.serial,
              instrument.calibratedOn,
              instrument.calibrationLapsed ? <Text style={{ color: colors.signal }}>{instrument.calibrationDueOn} lapsed</Text> : instrument.calibrationDueOn,
              instrument.uncertainty,
              String(instrument.setCount),
            ])}
          />
          <Text style={styles.subHeading}>Approved measurement sets, by unit</Text>
          <PdfTable
            columns={[
              { header: "Serial", width: "14%", mono: true },
              { header: "Lot", width: "12%", mono: true },
              { header: "Sets: id, kind, temperature, measured on", width: "74%" },
            ]}
            rows={unitsOf(traceability.measurementSets).map((unit) => [
              unit.serial,
              unit.lot,
              unit.sets.map((set) => `${set.id}  ${set.kind}, ${set.temperature || "temperature not stated"}, ${set.measuredOn}`),
            ])}
          />
        </>
      )}
    </View>
  );
}

function PdfNoDataNotice({ text }: { text: string }) {
  return <Text style={{ marginTop: 4, paddingLeft: 6, borderLeftWidth: 1.5, borderLeftColor: colors["rule-strong"], color: colors["ink-muted"] }}>{text}</Text>;
}

function unitsOf(sets: SheetModel["traceability"]["measurementSets"]) {
  const units: { serial: string; lot: string; sets: SheetModel["traceability"]["measurementSets"] }[] = [];
  for (const set of sets) {
    const last = units[units.length - 1];
    if (last && last.serial === set.serial) last.sets.push(set);
    else units.push({ serial: set.serial, lot: set.lot ?? "", sets: [set] });
  }
  return units;
}

function StatisticsAnnex({ model }: { model: SheetModel }) {
  const { statistics } = model;
  const flagged = statistics.groups.filter((g) => !g.supported);
  const cpkAbsent = describeAbsentCpk(statistics);
  const columns: Column[] = [
    { header: "Parameter, conditions", width: "27%" },
    { header: "n", width: "4%", align: "right", mono: true },
    { header: "Mean", width: "8%", align: "right", mono: true },
    { header: "s", width: "7%", align: "right", mono: true },
    { header: "Min", width: "8%", align: "right", mono: true },
    { header: "Max", width: "8%", align: "right", mono: true },
    { header: "Tol. low", width: "8.5%", align: "right", mono: true },
    { header: "Tol. high", width: "8.5%", align: "right", mono: true },
    { header: "Cpk", width: "6%", align: "right", mono: true },
    { header: "U", width: "6%", align: "right", mono: true },
    { header: "Pass", width: "6%", align: "right", mono: true },
    { header: "", width: "3%" },
  ];
  const rows = statistics.groups.map((g: StatisticsGroup): Cell[] => [
    [
      <>
        {g.label} <Text style={{ color: colors["ink-muted"] }}>{annexUnitText(g.unit)}</Text>
      </>,
      <Text style={{ color: colors["ink-muted"], fontSize: 6.8 }}>
        <PdfNotation text={g.conditionsText} subSize={5} />
      </Text>,
    ],
    String(g.n),
    g.mean.text,
    g.standardDeviation.text,
    g.min.text,
    g.max.text,
    g.toleranceInterval?.lower.text ?? "",
    g.toleranceInterval?.upper.text ?? "",
    g.cpkInterval ? [g.cpk.text, <Text style={{ color: colors["ink-muted"], fontSize: 6.8 }}>{formatCpkInterval(g)}</Text>] : g.cpk.text,
    g.expandedUncertainty.text,
    formatPassCount(g),
    g.supported ? "" : <Text style={{ color: colors.signal, fontWeight: 700 }}>!</Text>,
  ]);
  return (
    <View>
      <SectionHeading>Statistics annex</SectionHeading>
      <Text style={styles.paragraph}>{statistics.method}</Text>
      {model.noDataNotice ? <PdfNoDataNotice text={model.noDataNotice} /> : <PdfTable columns={columns} rows={rows} />}
      {cpkAbsent ? (
        <View wrap={false}>
          <Text style={styles.subHeading}>Cpk not stated</Text>
          <Text style={styles.paragraph}>
            {cpkAbsent}{" "}
            {statistics.groups
              .filter((g) => g.cpkAbsentReason)
              .map((g, i, all) => (
                <Text key={g.groupId}>
                  {g.label}, <PdfNotation text={g.conditionsText} />: n = {g.n}
                  {i < all.length - 1 ? "; " : "."}
                </Text>
              ))}
          </Text>
        </View>
      ) : null}
      {flagged.length > 0 ? (
        <View>
          <Text style={styles.subHeading}>Limits the data do not support</Text>
          {flagged.map((g) => (
            <View key={g.groupId} style={styles.listItem} wrap={false}>
              <Text style={[styles.bullet, { color: colors.signal }]}>!</Text>
              <Text style={{ flex: 1 }}>
                <Text style={{ fontWeight: 600 }}>
                  {g.label}, <PdfNotation text={g.conditionsText} />:
                </Text>{" "}
                {g.flags.map((f) => f.message).join(" ")}
              </Text>
            </View>
          ))}
        </View>
      ) : null}
      {statistics.decisionRules.length > 0 ? (
        <View>
          <Text style={styles.subHeading}>Decision rules (ISO/IEC 17025:2017 §7.8.6)</Text>
          {statistics.decisionRules.map((rule, i) => (
            <Text key={i} style={styles.paragraph}>
              {rule}
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
}

function RevisionHistory({ model }: { model: SheetModel }) {
  if (model.revisionHistory.length === 0) return null;
  return (
    <View wrap={false}>
      <SectionHeading>Revision history</SectionHeading>
      <PdfTable
        columns={[
          { header: "Revision", width: "12%" },
          { header: "Date", width: "16%", mono: true },
          { header: "Changes", width: "72%" },
        ]}
        rows={model.revisionHistory.map((entry) => [entry.label, entry.date, <PdfNotation key="summary" text={entry.summary} />])}
      />
    </View>
  );
}

/**
 * The release record: revision letter and date, where to verify it, one entry per electronic
 * signature (printed name, role, organization, UTC time, meaning: 21 CFR Part 11 §11.50; the full
 * SHA-256 of the candidate it signs: §11.70), then the release notes.
 */
function ReleaseRecord({ model }: { model: SheetModel }) {
  const { release, header } = model;
  if (!release) return null;
  const [first, ...rest] = release.signatures;
  return (
    <View>
      {/* The heading never stands alone at a page's foot: it keeps the first signature with it. */}
      <View wrap={false}>
        <SectionHeading>Release and signatures</SectionHeading>
        <Text style={styles.paragraph}>
          <Text style={{ fontWeight: 600 }}>{header.revisionText}</Text> of {header.partNumber}, released{" "}
          <Text style={styles.mono}>{release.releasedOn}</Text>. Its public record:{" "}
          <Text style={styles.mono}>{release.verificationReference}</Text> at{" "}
          <Link src={release.verificationUrl} style={{ color: colors.ink }}>
            {release.verificationUrl}
          </Link>
          .
        </Text>
        {first ? <PdfSignature signature={first} first /> : null}
      </View>
      {rest.map((signature, i) => (
        <PdfSignature key={i} signature={signature} />
      ))}
      <Text style={[styles.small, { borderTopWidth: 1.2, borderTopColor: colors.ink, paddingTop: 3 }]}>
        Signed electronically in Benchfold; each signature is bound to the reviewed candidate by the digest shown beside it.
      </Text>
      {release.notes.length > 0 ? (
        <View wrap={false}>
          <Text style={styles.subHeading}>Release notes, {header.revisionText}</Text>
          {release.notes.map((note, i) => (
            <View key={i} style={styles.listItem}>
              <Text style={styles.bullet}>•</Text>
              <Text style={{ flex: 1 }}>
                <PdfNotation text={note} />
              </Text>
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}

/** One signature, kept whole on its page: a strong rule above the first, hairlines between the others. */
function PdfSignature({ signature, first = false }: { signature: SheetSignature; first?: boolean }) {
  const label = { fontSize: 7, color: colors["ink-muted"] };
  return (
    <View
      wrap={false}
      style={{
        marginTop: first ? 2 : 0,
        paddingVertical: 5,
        borderTopWidth: first ? 1.2 : 0.4,
        borderTopColor: first ? colors.ink : colors.rule,
      }}
    >
      <View style={{ flexDirection: "row" }}>
        <View style={{ width: "42%", paddingRight: 8 }}>
          <Text style={label}>Signed by</Text>
          <Text style={{ fontSize: 10, fontWeight: 600, lineHeight: 1.25 }}>{signature.name}</Text>
          {/* One string: react-pdf hyphenates a word split across two text fragments at a line break. */}
          <Text>{`${signature.role}, ${signature.organizationName}`}</Text>
        </View>
        <View style={{ width: "58%" }}>
          <Text style={label}>Signed (UTC)</Text>
          <Text style={{ fontFamily: MONO_FAMILY, fontSize: 8.4, lineHeight: 1.45 }}>{signedAtText(signature.signedAt)}</Text>
          <Text>
            <Text style={{ color: colors["ink-muted"] }}>Meaning: </Text>
            {signature.meaning}
          </Text>
        </View>
      </View>
      <Text style={[label, { marginTop: 3 }]}>
        {candidateDigestLabel}: <Text style={{ fontFamily: MONO_FAMILY, fontSize: 6.8, color: colors.ink }}>{signature.candidateDigest}</Text>
      </Text>
    </View>
  );
}
