import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import reference from "./reference/si-prefix-factors.json";
import { betterDirectionOf, betterDirections } from "@/lib/catalog/better-direction";
import { buildCompareCharts, drawnAt } from "@/lib/catalog/compare-charts";
import { compareCsvFileName, compareTableCsv, csvField } from "@/lib/catalog/compare-csv";
import { compareCsvPath, comparePath, parseCompareSelection, serializeCompareSelection } from "@/lib/catalog/compare-selection";
import { buildCompareTable, unitFactor, type CompareInput, type CompareRow, type CompareSheet } from "@/lib/catalog/compare-table";
import { parameterCatalog } from "@/lib/analysis/catalog";
import { SERIES_STYLES } from "@/lib/charts/styles";
import type { SheetModel, SpecTableRow } from "@/lib/sheet/types";

/** The demo sheets' models as the snapshot test pins them (tests/unit/sheet/demo-sheets.test.ts). */
function demoModel(part: string): SheetModel {
  return JSON.parse(readFileSync(path.resolve(__dirname, `../sheet/__snapshots__/demo-${part}.json`), "utf8")) as SheetModel;
}

function sheet(part: string, letter = "A", organizationName = "Kestrine"): CompareSheet {
  return {
    key: `org/${part}/${letter}`,
    label: `${part} Rev. ${letter}`,
    organizationName,
    partNumber: part,
    letter,
    title: part,
    deviceClassLabel: "",
    releasedOn: "2026-12-01",
    standing: "current",
    path: `/datasheets/org/${part}/${letter}`,
  };
}

function input(part: string, model: SheetModel = demoModel(part)): CompareInput {
  return { sheet: sheet(part), model };
}

// The model prints a no-break space between a figure and its unit (lib/format); the strings below write it as \u00a0.
function find(rows: CompareRow[], label: string, field: CompareRow["field"], conditions = ""): CompareRow {
  const row = rows.find((r) => r.label === label && r.field === field && r.cells.some((c) => c?.conditionsText.includes(conditions)));
  if (!row) throw new Error(`no ${field} line for ${label} ${conditions}`);
  return row;
}

describe("the selection in the address", () => {
  it("reads a comma list, repeated parameters (the catalog's checkboxes), a part number with a slash, and drops a repeat", () => {
    const parsed = parseCompareSelection(new URLSearchParams("sheets=kestrine/KDX-2G4/B,pellacourt/KQH-2G/current&sheets=wrenfield-lab/WL/C2611/A&sheets=kestrine/KDX-2G4/B"));
    expect(parsed).toEqual({
      ok: true,
      sheets: [
        { organizationSlug: "kestrine", partNumber: "KDX-2G4", revision: "B" },
        { organizationSlug: "pellacourt", partNumber: "KQH-2G", revision: "current" },
        { organizationSlug: "wrenfield-lab", partNumber: "WL/C2611", revision: "A" },
      ],
    });
  });

  it("keeps the selection readable in the address and reads back what it writes", () => {
    const sheets = [
      { organizationSlug: "kestrine", partNumber: "KDX-2G4", revision: "B" },
      { organizationSlug: "wrenfield-lab", partNumber: "WL/C2611", revision: "current" },
    ];
    expect(serializeCompareSelection(sheets)).toBe("sheets=kestrine/KDX-2G4/B,wrenfield-lab/WL/C2611/current");
    expect(comparePath(sheets)).toBe("/compare?sheets=kestrine/KDX-2G4/B,wrenfield-lab/WL/C2611/current");
    expect(compareCsvPath(sheets)).toBe("/api/v1/compare/csv?sheets=kestrine/KDX-2G4/B,wrenfield-lab/WL/C2611/current");
    expect(parseCompareSelection(new URL(`http://x${comparePath(sheets)}`).searchParams)).toEqual({ ok: true, sheets });
  });

  it.each([
    ["nothing", {}, "none was given"],
    ["one sheet", { sheets: "kestrine/KDX-2G4/B" }, "only one was given"],
    ["the same sheet twice", { sheets: "kestrine/KDX-2G4/B,kestrine/KDX-2G4/B" }, "only one was given"],
    ["nine sheets", { sheets: Array.from({ length: 9 }, (_, i) => `kestrine/P-${i}/A`).join(",") }, "At most 4 sheets can be compared at once; 9 were given"],
    ["an entry without slashes", { sheets: "KDX-2G4,kestrine/KM-7H/A" }, '"KDX-2G4" is not a sheet\'s address'],
    ["an organization that cannot be a short name", { sheets: "Kestrine Labs/KDX-2G4/B,kestrine/KM-7H/A" }, "is not an organization's short name"],
    ["a part number with a space", { sheets: "kestrine/KDX 2G4/B,kestrine/KM-7H/A" }, "is not a part number"],
    ["a revision that is not a letter", { sheets: "kestrine/KDX-2G4/b2,kestrine/KM-7H/A" }, '"b2" is not a revision'],
    ["ten thousand characters", { sheets: "k/".repeat(5000) }, "characters long; at most 1000 are read"],
  ])("refuses %s, in words that name the problem", (_what, params, words) => {
    const parsed = parseCompareSelection(params as Record<string, string>);
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(parsed.issues.map((i) => i.message).join(" ")).toContain(words);
    expect(parsed.issues.every((i) => i.field === "sheets")).toBe(true);
  });
});

describe("which way is better", () => {
  it("has a word for every derived parameter (a new one must be decided, not defaulted)", () => {
    expect(Object.keys(betterDirections).sort()).toEqual(Object.keys(parameterCatalog).sort());
  });

  // Common practice of RF datasheets (no single published source): losses, mismatch and noise low;
  // suppression, isolation, return loss and compression or intercept points high; balance near zero.
  it.each([
    ["conversion-loss", "lower"],
    ["insertion-loss", "lower"],
    ["vswr", "lower"],
    ["spot-phase-noise", "lower"],
    ["harmonic-suppression", "higher"],
    ["isolation", "higher"],
    ["return-loss", "higher"],
    ["input-p1db", "higher"],
    ["iip3", "higher"],
    ["amplitude-balance", "nearer-zero"],
    ["phase-balance", "nearer-zero"],
    ["optimum-drive", null],
    ["no-such-parameter", null],
  ])("%s: %s", (parameter, direction) => {
    expect(betterDirectionOf(parameter)).toBe(direction);
  });
});

describe("the compare table of two released hybrids (demo KQH-2G and PS-2W)", () => {
  const table = buildCompareTable([input("KQH-2G"), input("PS-2W")]);

  it("aligns each figure by parameter and port, with one value per sheet", () => {
    const vswrPort2 = find(table.rows, "VSWR, highest in band", "typ", "Port 2");
    expect(vswrPort2.cells.map((c) => c?.text)).toEqual(["1.15", "1.17"]);
    expect(vswrPort2.cells.map((c) => c?.conditionsText)).toEqual(["Band 1.7–2.3\u00a0GHz, Port 2, T_A 25\u00a0°C", "Band 0.5–2.5\u00a0GHz, Port 2, T_A 25\u00a0°C"]);
    // Port 4 exists on the 90° hybrid only: the splitter's cell is empty, not filled from another port.
    const vswrPort4 = find(table.rows, "VSWR, highest in band", "typ", "Port 4");
    expect(vswrPort4.cells.map((c) => c?.text ?? null)).toEqual(["1.16", null]);
    expect(vswrPort4.statedCount).toBe(1);
    expect(vswrPort4.cells[0]!.better).toBe(false);
  });

  it("shows a condition mismatch: which condition differs, and each sheet's own", () => {
    const il = find(table.rows, "Insertion loss, port 1 to 2 (S21)", "typ");
    expect(il.conditionsMatch).toBe(false);
    expect(il.differingConditions).toEqual(["band"]);
    // What both share is said once for the line; what differs stays with each value.
    expect(il.conditionsText).toBe("T_A 25\u00a0°C");
    expect(il.cells.map((c) => c?.ownConditionsText)).toEqual(["Band 1.7–2.3\u00a0GHz", "Band 0.5–2.5\u00a0GHz"]);
  });

  it("marks the better value per line by the parameter's direction", () => {
    const il = find(table.rows, "Insertion loss, port 1 to 2 (S21)", "typ");
    expect(il.cells.map((c) => c?.better)).toEqual([true, false]); // 3.24 dB against 3.50 dB: lower is better
    const amplitude = find(table.rows, "Amplitude balance", "typ");
    expect(amplitude.cells.map((c) => c?.better)).toEqual([false, true]); // 0.28 against 0.05 dB: nearer zero
    const phase = find(table.rows, "Phase balance, from nominal", "typ");
    expect(phase.cells.map((c) => c?.text)).toEqual(["\u22121.5", "\u22120.8"]);
    expect(phase.cells.map((c) => c?.better)).toEqual([false, true]); // |−0.8°| < |−1.5°|
    const isolation = find(table.rows, "Isolation, port 2 to 3 (S32)", "typ");
    expect(isolation.cells.map((c) => c?.better)).toEqual([true, false]); // 22.5 against 18.0 dB: higher is better
  });

  it("keeps the first sheet's table order, one line per stated min, typ and max", () => {
    expect(table.rows.slice(0, 3).map((r) => [r.label, r.field])).toEqual([
      ["Insertion loss, port 1 to 2 (S21)", "typ"],
      ["Insertion loss, port 1 to 2 (S21)", "max"],
      ["Insertion loss, port 1 to 3 (S31)", "typ"],
    ]);
    expect(new Set(table.rows.map((r) => r.id)).size).toBe(table.rows.length);
  });
});

/** A one-row sheet model: only what the table reads. */
function oneRowModel(rows: Partial<SpecTableRow>[], columns = [{ id: "frequency", label: "Frequency" }, { id: "temperature", label: "T_A" }]): SheetModel {
  const figure = (text: string) => ({ value: text ? Number(text.replace("\u2212", "-")) : null, text });
  return {
    specifications: {
      conditionColumns: columns,
      rows: rows.map((r) => ({
        groupId: `${r.rowId}:${r.conditionsKey}`,
        rowId: "x",
        parameter: "x",
        conditionsKey: "",
        label: "X",
        symbol: "X",
        unit: "dB",
        conditions: ["", ""],
        min: figure(""),
        typ: figure(""),
        max: figure(""),
        typIsMeasuredMean: false,
        basis: "test",
        basisMark: "",
        footnoteMarks: [],
        n: 3,
        supported: true,
        ...r,
      })),
    },
    charts: [],
  } as unknown as SheetModel;
}

const fig = (text: string) => ({ value: Number(text.replace("\u2212", "-")), text });

describe("units and conditions", () => {
  it("converts a figure stated with another SI prefix to the line's unit, and says how it was stated", () => {
    const jitter = { rowId: "rms-jitter", parameter: "rms-jitter", label: "RMS jitter", symbol: "σt", conditionsKey: "temperatureC=25", conditions: ["", "25 °C"] };
    const a = oneRowModel([{ ...jitter, unit: "ps", typ: fig("1.20") }]);
    const b = oneRowModel([{ ...jitter, unit: "ns", typ: fig("0.000950") }]);
    const table = buildCompareTable([input("A", a), input("B", b)]);
    expect(table.rows).toHaveLength(1);
    const [row] = table.rows;
    expect(row.unit).toBe("ps");
    expect(row.cells.map((c) => c?.text)).toEqual(["1.20", "0.95"]);
    expect(row.cells[1]!.value).toBeCloseTo(0.95, 12);
    expect(row.cells[1]!.stated).toEqual({ text: "0.000950", unit: "ns" });
    expect(row.cells.map((c) => c?.better)).toEqual([false, true]);
  });

  // Reference: scipy.constants (Debian python3-scipy), prefix ratios; scripts/reference/si-prefix-factors.py.
  it.each(reference.pairs)("$from → $to is ×$factor, as scipy.constants has it", ({ from, to, factor }) => {
    expect(unitFactor(from, to)).not.toBeNull();
    expect(unitFactor(from, to)!).toBeCloseTo(factor, 12);
    expect(unitFactor(from, to)! / factor).toBeCloseTo(1, 12);
  });

  it("never converts logarithmic units or different quantities, and keeps such figures on lines of their own", () => {
    expect(unitFactor("dB", "dBm")).toBeNull();
    expect(unitFactor("dBc", "dBc/Hz")).toBeNull();
    expect(unitFactor("GHz", "ns")).toBeNull();
    expect(unitFactor("deg", "°")).toBe(1);
    const row = { rowId: "r", parameter: "conversion-loss", label: "Loss", conditionsKey: "temperatureC=25", conditions: ["", "25 °C"] };
    const table = buildCompareTable([input("A", oneRowModel([{ ...row, unit: "dB", typ: fig("7.0") }])), input("B", oneRowModel([{ ...row, unit: "dBm", typ: fig("6.0") }]))]);
    expect(table.rows.map((r) => [r.unit, r.cells.map((c) => c?.text ?? null)])).toEqual([
      ["dB", ["7.0", null]],
      ["dBm", [null, "6.0"]],
    ]);
    expect(table.rows.every((r) => r.cells.every((c) => !c?.better))).toBe(true);
  });

  it("pairs a sheet's groups with the other's by the conditions they share: exact first, then most shared", () => {
    const row = { rowId: "cl", parameter: "conversion-loss", label: "Conversion loss", unit: "dB" };
    const at = (hz: number, c: number, typ: string): Partial<SpecTableRow> => ({
      ...row,
      conditionsKey: `drive=10;inputFrequencyHz=${hz};temperatureC=${c}`,
      conditions: [`${hz / 1e9} GHz in`, `${c} °C`],
      typ: fig(typ),
    });
    // A states 1 GHz at 25 °C and at 85 °C; B states 1.5 GHz at 85 °C and 1 GHz at 25 °C.
    const a = oneRowModel([at(1e9, 25, "9.5"), at(1e9, 85, "10.4")]);
    const b = oneRowModel([at(1.5e9, 85, "10.1"), at(1e9, 25, "9.9")]);
    const table = buildCompareTable([input("A", a), input("B", b)]);
    expect(table.rows.map((r) => [r.cells.map((c) => c?.text), r.conditionsMatch, r.differingConditions])).toEqual([
      [["9.5", "9.9"], true, []],
      [["10.4", "10.1"], false, ["input frequency"]],
    ]);
    expect(table.rows[1].cells.map((c) => c?.ownConditionsText)).toEqual(["Frequency 1 GHz in", "Frequency 1.5 GHz in"]);
    expect(table.rows[1].cells.map((c) => c?.better)).toEqual([false, true]);
    // The identity of a figure (the harmonic order, the offset) never pairs across: order 3 is not order 1.
    const order = (n: number, typ: string): Partial<SpecTableRow> => ({ ...row, parameter: "harmonic-suppression", rowId: "hs", conditionsKey: `order=${n};temperatureC=25`, typ: fig(typ) });
    const split = buildCompareTable([input("A", oneRowModel([order(1, "22")])), input("B", oneRowModel([order(3, "29")]))]);
    expect(split.rows).toHaveLength(2);
  });

  it("marks every value of a tie, and none when all are equal", () => {
    const row = { rowId: "il", parameter: "insertion-loss", label: "IL", unit: "dB", conditionsKey: "" };
    const three = (x: string, y: string, z: string) =>
      buildCompareTable([input("A", oneRowModel([{ ...row, max: fig(x) }])), input("B", oneRowModel([{ ...row, max: fig(y) }])), input("C", oneRowModel([{ ...row, max: fig(z) }]))]).rows[0];
    expect(three("0.40", "0.30", "0.30").cells.map((c) => c?.better)).toEqual([false, true, true]);
    expect(three("0.30", "0.30", "0.30").cells.map((c) => c?.better)).toEqual([false, false, false]);
  });
});

describe("the CSV export", () => {
  const table = buildCompareTable([input("KQH-2G"), input("PS-2W")]);
  const csv = compareTableCsv(table);
  const lines = csv.replace(/^\uFEFF/, "").split("\r\n");

  it("is RFC 4180 text with a header naming each sheet's columns, one line per figure, CRLF ends", () => {
    expect(csv.startsWith("\uFEFF")).toBe(true);
    expect(csv.endsWith("\r\n")).toBe(true);
    expect(lines[0]).toBe(
      "Parameter,Symbol,Figure,Unit,Better,Conditions,KQH-2G Rev. A,KQH-2G Rev. A conditions,KQH-2G Rev. A basis,PS-2W Rev. A,PS-2W Rev. A conditions,PS-2W Rev. A basis,Better value",
    );
    expect(lines).toHaveLength(table.rows.length + 2); // header, rows, and the empty string after the last CRLF
    expect(lines[1]).toBe(
      // PS-2W states no limit (typical values of one unit): characterization, not test.
      '"Insertion loss, port 1 to 2 (S21)",IL,typ,dB,lower is better,differ: band,3.24,"Band 1.7–2.3\u00a0GHz, T_A 25\u00a0°C",test,3.50,"Band 0.5–2.5\u00a0GHz, T_A 25\u00a0°C",characterization,KQH-2G Rev. A',
    );
    // The page's figures, with a hyphen-minus for a spreadsheet.
    expect(lines.find((l) => l.startsWith('"Phase balance, from nominal",Δφ,typ'))).toContain(",-1.5,");
  });

  it("quotes what needs quoting and defuses formulas, but leaves signed figures numbers", () => {
    expect(csvField('say "hi", then')).toBe('"say ""hi"", then"');
    expect(csvField("two\nlines")).toBe('"two\nlines"');
    expect(csvField("=HYPERLINK(1)")).toBe("'=HYPERLINK(1)");
    expect(csvField("@SUM(A1)")).toBe("'@SUM(A1)");
    expect(csvField("-1.5")).toBe("-1.5");
    expect(csvField("+7")).toBe("+7");
    expect(csvField("-cmd")).toBe("'-cmd");
  });

  it("names the file by the parts and letters", () => {
    expect(compareCsvFileName({ sheets: [sheet("KQH-2G"), sheet("WL/C2611", "B")] })).toBe("KQH-2G-A_WL_C2611-B-compare.csv");
  });
});

describe("the overlaid curves", () => {
  const inputs = ["KQH-2G", "PS-2W", "KM-7H"].map((p) => ({ label: `${p} Rev. A`, model: demoModel(p) }));
  const { charts, single } = buildCompareCharts(inputs, { width: 560 });

  it("overlays each chart two or more sheets carry, one panel per series, and names the rest", () => {
    expect(charts.map((c) => c.chartId)).toEqual(["insertion-loss", "isolation", "amplitude-balance", "phase-balance", "return-loss"]);
    expect(single).toEqual([
      {
        label: "KM-7H Rev. A",
        titles: ["Conversion loss vs RF frequency", "Isolation vs RF frequency", "Tone and IM3 output vs input per tone", "Highest conversion loss in band vs temperature"],
      },
    ]);
    // The mixer's port match joins the network analyzer's return-loss panel of the hybrid and the splitter.
    expect(charts[4].sources.map((s) => s.label)).toEqual(["KQH-2G Rev. A", "PS-2W Rev. A", "KM-7H Rev. A"]);
    const [insertionLoss, isolation] = charts;
    expect(insertionLoss.panels.map((p) => p.series)).toEqual(["Insertion loss S21", "Insertion loss S31"]);
    expect(insertionLoss.unmatched).toEqual([]);
    expect(isolation.panels.map((p) => p.series)).toEqual(["Isolation S32"]);
    // S41 and port 4 exist on the 90° hybrid only: named, not drawn as a one-sheet "comparison".
    expect(isolation.unmatched).toEqual([{ series: "Isolation S41", label: "KQH-2G Rev. A" }]);
    expect(insertionLoss.sources.map((s) => s.drawnAt)).toEqual(["1.7–2.3\u00a0GHz, 25\u00a0°C", "0.5–2.5\u00a0GHz, 25\u00a0°C", null]);
    expect(insertionLoss.conditionsDiffer).toBe(true);
  });

  it("tells the sheets apart by colour, dash and point shape, each sheet the same on every panel", () => {
    for (const chart of charts) {
      for (const panel of chart.panels) {
        const layers = panel.vegaLite.layer as { mark: { type: string }; encoding: Record<string, { scale?: { domain: string[]; range: unknown[] } }> }[];
        const line = layers.find((l) => l.mark.type === "line")!;
        const points = layers.find((l) => l.mark.type === "point")!;
        const domain = line.encoding.color.scale!.domain;
        domain.forEach((label, i) => {
          const style = SERIES_STYLES[inputs.findIndex((s) => s.label === label)];
          expect(line.encoding.color.scale!.range[i]).toBe(style.colour);
          expect(line.encoding.strokeDash.scale!.range[i]).toEqual(style.dash);
          expect(points.encoding.shape.scale!.range[i]).toBe(style.shape);
        });
        expect(new Set(line.encoding.strokeDash.scale!.range.map((d) => JSON.stringify(d))).size).toBe(domain.length);
        expect((panel.vegaLite as { width: unknown }).width).toBe(560);
      }
    }
  });

  it("draws each sheet's typical curve: the median of its units at each frequency", () => {
    const panel = charts[2].panels[0];
    const hybrid = demoModel("KQH-2G").charts.find((c) => c.id === "amplitude-balance")!;
    const values = (hybrid.vegaLite as { data: { values: { x: number; y: number; unit: string }[] } }).data.values;
    const x0 = Math.min(...values.map((v) => v.x));
    const atX0 = values.filter((v) => v.x === x0).map((v) => v.y).sort((a, b) => a - b);
    // Three units: the median is the middle one. x is read back in Hz from the GHz axis.
    expect(atX0).toHaveLength(3);
    const typical = panel.traces[0].typical;
    expect(typical[0][0]).toBeCloseTo(x0 * 1e9, 0);
    expect(typical[0][1]).toBeCloseTo(atX0[1], 9);
    expect(panel.traces[0].unitCount).toBe(3);
    expect(panel.traces[2]).toEqual({ label: "KM-7H Rev. A", unitCount: 0, typical: [], leftOut: null });
  });

  it("says when the curves coincide (one revision against the next with the same units), and not otherwise", () => {
    const kdx = demoModel("KDX-2G4");
    const same = buildCompareCharts(
      [
        { label: "A", model: kdx },
        { label: "B", model: kdx },
      ],
      { width: 400 },
    );
    expect(same.charts.flatMap((c) => c.panels).every((p) => p.coincide)).toBe(true);
    expect(charts.flatMap((c) => c.panels).some((p) => p.coincide)).toBe(false);
  });

  it("reads where a chart was drawn from its caption", () => {
    expect(drawnAt({ caption: "Each line one unit. 4 units drawn at 1 GHz in, 25 °C. Open circles: optimum (4)." })).toBe("1 GHz in, 25 °C");
    expect(drawnAt({ caption: "Each line one unit. 12 units drawn at 2 GHz out, 25 °C (first 12 of 14 by serial)." })).toBe("2 GHz out, 25 °C");
    expect(drawnAt({ caption: "No conditions here" })).toBe("No conditions here");
  });
});
