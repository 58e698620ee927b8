import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { specificationsCsv } from "@/lib/catalog/sheet-csv";
import type { SheetModel } from "@/lib/sheet/types";
import { doublerCandidateAndRelease } from "../sheet/released-fixture";

/** Reads CSV text with Python's csv module (RFC 4180 dialect "excel"), the reader outside the project. */
function pythonCsvRows(text: string): string[][] {
  const script = "import csv, io, json, sys; t = sys.stdin.buffer.read().decode('utf-8-sig'); print(json.dumps(list(csv.reader(io.StringIO(t, newline='')))))";
  return JSON.parse(execFileSync("/usr/bin/python3", ["-c", script], { input: text, encoding: "utf8" })) as string[][];
}

describe("a released sheet's specification table as CSV", () => {
  const { released } = doublerCandidateAndRelease();
  const csv = specificationsCsv(released);
  const rows = pythonCsvRows(csv);
  const spec = released.specifications;

  it("is RFC 4180 text with CRLF line ends and a byte-order mark, one line per row and condition group", () => {
    expect(csv.startsWith("\uFEFF")).toBe(true);
    expect(csv.endsWith("\r\n")).toBe(true);
    expect(csv.replace(/\r\n/g, "")).not.toMatch(/\n/);
    expect(rows.length).toBe(spec.rows.length + 1);
    expect(rows[0]).toEqual(["Parameter", "Symbol", ...spec.conditionColumns.map((c) => c.label), "Min", "Typ", "Max", "Unit", "Basis", "Typ is measured mean", "Units measured"]);
  });

  it("carries each row's figures as the sheet prints them, read back by Python's csv module", () => {
    const k = spec.conditionColumns.length;
    spec.rows.forEach((row, i) => {
      const line = rows[i + 1];
      expect(line[0]).toBe(row.label);
      // A condition that starts with a sign ("+10 dBm per port") is set off with an apostrophe (OWASP, "CSV Injection").
      expect(line.slice(2, 2 + k)).toEqual(row.conditions.map((c) => (/^[=+\-@]/.test(c) ? `'${c}` : c)));
      expect(line[2 + k]).toBe(row.min.text.replace(/\u2212/g, "-"));
      expect(line[3 + k]).toBe(row.typ.text.replace(/\u2212/g, "-"));
      expect(line[4 + k]).toBe(row.max.text.replace(/\u2212/g, "-"));
      expect(line[5 + k]).toBe(row.unit);
      expect(line[8 + k]).toBe(String(row.n));
      // The printed number reads back as the model's value to within half its last printed digit
      // (a measured typical is rounded to the decade of the units' spread, so it may have none).
      if (row.typ.value !== null && row.typ.text) {
        const decimals = (line[3 + k].split(".")[1] ?? "").length;
        expect(Math.abs(Number(line[3 + k]) - row.typ.value)).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-9);
      }
    });
    expect(rows.some((r) => r[2 + k].startsWith("-") || r[3 + k].startsWith("-") || r[4 + k].startsWith("-"))).toBe(true);
  });

  it("quotes commas and quotes, and sets off text a spreadsheet would run as a formula", () => {
    const base = spec.rows[0];
    const model = {
      specifications: {
        ...spec,
        rows: [
          { ...base, label: 'Gain, "small signal"', symbol: "=HYPERLINK(\"x\")" },
          { ...base, label: "@SUM(A1)", min: { value: -3, text: "\u22123.0" } },
        ],
      },
    } as Pick<SheetModel, "specifications">;
    const back = pythonCsvRows(specificationsCsv(model));
    expect(back[1][0]).toBe('Gain, "small signal"');
    expect(back[1][1]).toBe("'=HYPERLINK(\"x\")");
    expect(back[2][0]).toBe("'@SUM(A1)");
    // A plain negative number stays a number.
    expect(back[2][2 + spec.conditionColumns.length]).toBe("-3.0");
  });
});
