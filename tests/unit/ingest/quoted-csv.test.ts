import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { detectKind, IngestError, parseDriveSweep, parseFrequencySweep, parseMeasurementFile, parseTwoTone } from "@/lib/ingest";
import { parseMappedFile, readForeignTable } from "@/lib/ingest/column-mapping";
import { locateQuoteProblem, tokenizeCsv, tokenizeCsvWhole } from "@/lib/ingest/csv-tokens";
import { mulberry32 } from "@/lib/stats/seeded-random";
import { fixtureBytes } from "./fixture-files";

// RFC 4180 ("Common Format and MIME Type for Comma-Separated Values Files", IETF 2005), §2:
// rule 5 fields may be enclosed in double quotes; rule 6 fields containing line breaks, double
// quotes or commas should be enclosed; rule 7 a double quote inside a quoted field is doubled.

function caught(f: () => unknown): IngestError {
  try {
    f();
  } catch (e) {
    if (e instanceof IngestError) return e;
    throw e;
  }
  throw new Error("expected an IngestError");
}

const enc = (text: string) => new TextEncoder().encode(text);

describe("RFC 4180 quoting in our CSV files", () => {
  it("reads a spreadsheet export: quoted headers, an embedded delimiter, doubled quotes, a CRLF inside quotes", () => {
    const r = parseMeasurementFile({ fileName: "frequency-sweep-quoted.csv", bytes: fixtureBytes("examples", "frequency-sweep-quoted.csv") });
    if (r.kind !== "frequency-sweep") throw new Error(r.kind);
    expect(r.data.frequencyHz).toEqual([500e6, 600e6, 700e6, 800e6, 900e6]);
    expect(r.data.conversionLossDb).toEqual([6.03, 6.01, 6.14, 6.13, 6.22]);
    expect(r.data.isolationLoRfDb).toEqual([37.29, 36.97, 36.53, 35.91, 35.27]);
    expect(r.data.loPowerDbm).toBe(7);
    expect(r.warnings).toEqual(['column "remark, operator" is not used by this kind and was ignored']);
  });

  it("gives each record the physical line it starts on, after quoted line breaks (CRLF and LF)", () => {
    const text = 'a,b\r\n1,"x\r\ny"\r\n2,"p\nq\nr"\n\n# c "q, r\n3,4\n';
    const t = tokenizeCsv({ fileName: "t.csv", text, from: 0, firstLine: 10, delimiter: "," });
    expect(t.cells).toEqual([["a", "b"], ["1", "x\ny"], ["2", "p\nq\nr"], ["3", "4"]]);
    expect(t.lines).toEqual([10, 11, 13, 18]);
  });

  it("record lines agree with csv-parse's own line count on random LF files with comments, blanks and quoted line breaks", () => {
    let seed = 11;
    const rand = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
    const pieces = ["1", " 2 ", '"3"', ' "a, b" ', '"x\ny"', '"p ""q"" r"', '"\n#not a comment\n"', "", '"#5"'];
    for (let trial = 0; trial < 200; trial++) {
      const out: string[] = [];
      for (let r = 0; r < 12; r++) {
        const u = rand();
        if (u < 0.1) out.push("");
        else if (u < 0.15) out.push("  \t ");
        else if (u < 0.25) out.push(`${rand() < 0.5 ? "  " : ""}# note "with, quote`);
        else out.push([0, 1, 2].map(() => pieces[Math.floor(rand() * pieces.length)]).join(","));
      }
      const text = `h1,h2,h3\n${out.join("\n")}\n`;
      const expected: number[] = [];
      parse(text, {
        delimiter: ",",
        record_delimiter: "\n",
        trim: true,
        comment: "#",
        comment_no_infix: true,
        skip_empty_lines: true,
        relax_column_count: true,
        on_record: (rec: string[], ctx: { lines: number }) => {
          expected.push(ctx.lines - rec.reduce((n, c) => n + c.split("\n").length - 1, 0));
          return null;
        },
      });
      expect(tokenizeCsv({ fileName: "r.csv", text, from: 0, firstLine: 1, delimiter: "," }).lines).toEqual(expected);
    }
  });

  it("record by record reads exactly as csv-parse on the whole text: cells, lines and every error", () => {
    // Seeded files of every delimiter mixing plain records with the ones handed to csv-parse (doubled
    // quotes, quoted line breaks, "#", CR, FF, no-break spaces, tabs) and quoting mistakes.
    const random = mulberry32(4180);
    const pick = <T,>(items: readonly T[]) => items[Math.floor(random() * items.length)];
    const pieces = ["1", " 2.5 ", '"3"', ' "a, b" ', '"a; b"', '"x\ny"', '"x\r\ny"', '"p ""q"" r"', '""', "", '"#5"', "a#b", " \u00a0 7", "8\u00a0",
      "\f9", "1\r", "4\t ", " \t5\t", '"u" \t', "\t", '"\n#not a comment\n"', "µ", '"Ω"'];
    const broken = ['a"b', '"a"b', '"open', '"a" "b"', ' "x""'];
    for (let trial = 0; trial < 400; trial++) {
      const delimiter = pick([",", ";", "\t"] as const);
      const out: string[] = [];
      for (let r = 0; r < 10; r++) {
        const u = random();
        if (u < 0.08) out.push("");
        else if (u < 0.12) out.push(pick(["  \t ", "\t", "  "]));
        else if (u < 0.2) out.push(`${pick(["", "  ", "\t"])}# note "with, quote`);
        else if (u < 0.22 && trial % 4 === 0) out.push(["1", pick(broken), "2"].join(delimiter));
        else out.push([0, 1, 2].map(() => pick(pieces)).join(delimiter));
      }
      const text = `h1${delimiter}h2${delimiter}h3${pick(["\n", "\r\n"])}${out.join(pick(["\n", "\r\n"]))}${pick(["\n", ""])}`;
      const opts = { fileName: "r.csv", text, from: 0, firstLine: 3, delimiter };
      const read = (f: typeof tokenizeCsv) => {
        try {
          return f(opts);
        } catch (e) {
          return { error: e instanceof IngestError ? e.toJSON() : String(e) };
        }
      };
      const whole = read(tokenizeCsvWhole);
      expect(read(tokenizeCsv), JSON.stringify(text)).toEqual(whole);
      if (!("error" in whole)) {
        const direct = parse(text.replace(/\r\n/g, "\n"), { delimiter, record_delimiter: "\n", quote: '"', escape: '"', trim: true, comment: "#", comment_no_infix: true, skip_empty_lines: true, relax_column_count: true });
        expect(whole.cells).toEqual(direct);
      }
    }
  });

  it("a doubled quote is one quote, and spaces around a quoted cell are ignored", () => {
    const t = tokenizeCsv({ fileName: "t.csv", text: 'x;y\n  "12 ""N"" type" ;  "-3,5"  \n', from: 0, firstLine: 1, delimiter: ";" });
    expect(t.cells[1]).toEqual(['12 "N" type', "-3,5"]);
  });

  it("a semicolon file with quoted decimal commas keeps the decimal comma", () => {
    const text = [
      "# kind: two-tone",
      "# serial: BFD-0300",
      '"input_power [dBm]";"fund_out [dBm]";"im3_out [dBm]";"note; free text"',
      '"-20,0";"-26,5";"-90,25";"a;b"',
      '"-15,0";"-21,5";"-75,25";""',
    ].join("\n");
    const r = parseTwoTone("tt.csv", text);
    expect(r.data.inputPowerPerToneDbm).toEqual([-20, -15]);
    expect(r.data.im3OutputDbm).toEqual([-90.25, -75.25]);
  });

  it("a quoted header with a line break inside names the data rows by their physical lines", () => {
    const text = ["# kind: frequency-sweep", "# serial: BFD-0301", '"frequency', '[MHz]",conversion_loss [dB]', "500,6.0", "600,x"].join("\n");
    const e = caught(() => parseFrequencySweep("h.csv", text));
    expect(e.code).toBe("bad-number");
    expect(e.message).toBe('h.csv line 6, column 2 ("conversion_loss [dB]"): expected a number in dB, found "x"');
  });

  it("a cell that spans lines is reported on the line where it starts", () => {
    const text = ["# kind: frequency-sweep", "# serial: BFD-0302", "frequency [MHz],conversion_loss [dB]", '500,"6.0', '1"', "600,6.2"].join("\n");
    const e = caught(() => parseFrequencySweep("m.csv", text));
    expect(e.code).toBe("bad-number");
    expect(e.line).toBe(4);
    expect(e.column).toBe(2);
    expect(e.found).toBe("6.0?1");
  });

  it("the delimiter is taken from the header outside its quotes", () => {
    const text = ["# kind: frequency-sweep", "# serial: BFD-0303", '"frequency [MHz]";"conversion_loss [dB], typ."', "500;6,1", "600;6,2"].join("\n");
    const e = caught(() => parseFrequencySweep("d.csv", text));
    // The header reads as two columns split on the semicolon; the second has text after its unit.
    expect(e.code).toBe("unknown-unit");
    expect(e.column).toBe(2);
  });

  it("kind detection reads quoted header names", () => {
    expect(detectKind("k.csv", '"input_power [dBm]","p2_out [dBm]"\n1,2\n')).toBe("drive-sweep");
    expect(detectKind("k.csv", '"frequency [MHz]";"conversion_loss [dB]"\n1;2\n')).toBe("frequency-sweep");
  });

  it("an unquoted file reads the same through either path", () => {
    const lines = ["# kind: drive-sweep", "# serial: BFD-0304", "# input_frequency: 1 GHz", "# wanted_order: 2", "input_power [dBm],p2_out [dBm]"];
    for (let i = 0; i < 20; i++) lines.push(`${i - 5},${(i * 0.37 - 30).toFixed(2)}`);
    const plain = parseDriveSweep("p.csv", lines.join("\n"));
    lines.push("# a comment that happens to hold a quote: 5\" cable");
    const viaParser = parseDriveSweep("p.csv", lines.join("\n"));
    expect(viaParser.data).toEqual(plain.data);
  });

  it("quoting mistakes are located at the quote itself", () => {
    expect(locateQuoteProblem('a,b\n1,"2\n3,4\n', ",")).toMatchObject({ line: 2, column: 2, detail: expect.stringContaining("never closed") });
    expect(locateQuoteProblem('a,b\n1,"2" x,3\n', ",")).toMatchObject({ line: 2, column: 2, found: "x" });
    expect(locateQuoteProblem('a,b\n# "open\n1,2"x\n', ",")).toMatchObject({ line: 3, column: 2, found: '"x' });
    expect(locateQuoteProblem('a,b\n"1\n2",3\n', ",")).toBeUndefined();
  });

  it("every quoting error is a 4xx-shaped IngestError with file, line and column", () => {
    const e = caught(() => parseMeasurementFile({ fileName: "u.csv", bytes: fixtureBytes("malformed", "quoted-unclosed.csv") }));
    expect(e.toJSON()).toMatchObject({ code: "bad-quoting", fileName: "u.csv", line: 8, column: 2 });
  });
});

describe("foreign files with quoted headers, through a column mapping", () => {
  const foreign = enc(
    [
      "# exported by a bench script",
      '"Freq, MHz","Output, dBm","Comment"',
      '"1000","-3.20","first, warm-up"',
      '"1100","-3.40","operator: ""ok"""',
      '"1200","-3.70","two',
      'lines"',
      '"1300","n/a","x"',
    ].join("\r\n"),
  );

  it("the preview shows the quoted headers whole", () => {
    const t = readForeignTable("f.csv", foreign);
    expect(t.delimiter).toBe(",");
    expect(t.headerLine).toBe(2);
    expect(t.headers).toEqual(["Freq, MHz", "Output, dBm", "Comment"]);
    expect(t.preview[1]).toEqual(["1100", "-3.40", 'operator: "ok"']);
  });

  it("a mapped file is read, and its errors point at the original line and column", () => {
    const mapping = [
      { column: "Freq, MHz", target: "frequency", unit: "MHz" },
      { column: "Output, dBm", target: "output_power", unit: "dBm" },
    ];
    const e = caught(() => parseMappedFile({ fileName: "f.csv", bytes: foreign, kind: "frequency-sweep", mapping, metadata: { serial: "BFD-0400" } }));
    expect(e.code).toBe("bad-number");
    // Line 5 holds a quoted line break, so "n/a" is on physical line 7.
    expect(e.line).toBe(7);
    expect(e.column).toBe(2);
    expect(e.field).toBe("Output, dBm");
    const good = enc(new TextDecoder().decode(foreign).replace('"n/a"', '"-3.90"'));
    const r = parseMappedFile({ fileName: "f.csv", bytes: good, kind: "frequency-sweep", mapping, metadata: { serial: "BFD-0400" } });
    if (r.kind !== "frequency-sweep") throw new Error(r.kind);
    expect(r.data.outputPowerDbm).toEqual([-3.2, -3.4, -3.7, -3.9]);
  });
});
