import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { SheetProse } from "@/components/sheet/sheet-prose";
import { SheetView } from "@/components/sheet/sheet-view";
import { sheetContentBodySchema } from "@/lib/schemas/sheets";
import { buildSheetModel, findProseLimitBreach, type ProseBlock, type ProseLimit, proseLimits, renderProse, serializeSheetModel } from "@/lib/sheet";
import { demoSheets } from "@/models/seeders/demo-sheets";
import { combGeneratorTemplate, doubleBalancedMixerTemplate, frequencyMultiplierTemplate, quadratureHybridTemplate } from "@/templates";
import { loadDoublerInput } from "./fixture";

const lines = (count: number, line: (i: number) => string) => Array.from({ length: count }, (_, i) => line(i)).join("\n");

describe("prose limits", () => {
  it("take quotes, lists, emphasis and links nested 10 levels deep, and refuse 11", () => {
    // 4 quotes + 3 lists + strong + emphasis + link = 10.
    const ten = "> > > > - - - ***[deep](https://example.org)***";
    expect(findProseLimitBreach(ten)).toBeNull();
    const { blocks, breach } = renderProse(ten);
    expect(breach).toBeUndefined();
    expect(JSON.stringify(blocks)).toContain('"href":"https://example.org"');
    expect(findProseLimitBreach(`> ${ten}`)?.limit).toBe("nesting");
    const nineStrongAndALink = `${"**a ".repeat(9)}[x](https://example.org)${" a**".repeat(9)}`;
    expect(findProseLimitBreach(nineStrongAndALink)).toBeNull();
  });

  // Every one of these overflowed the stack, held the process for seconds, or both, before the limits.
  it.each<[string, string, ProseLimit]>([
    ["5,000 nested quotes", `${">".repeat(5000)} x`, "nesting"],
    ["50 nested quotes with spaces", `${"> ".repeat(50)}x`, "nesting"],
    ["5,000 nested list markers on one line", `${"- ".repeat(5000)}a`, "nesting"],
    ["12 nested ordered lists", `${"1. ".repeat(12)}a`, "nesting"],
    ["a list nested by indentation, 100 levels", lines(100, (i) => `${"  ".repeat(i)}- a`), "nesting"],
    ["quotes nested 60 deep across lines", lines(60, (i) => `${">".repeat(i + 1)} a`), "nesting"],
    ["emphasis nested 5,000 deep", `${"*".repeat(5000)}x${"*".repeat(5000)}`, "emphasis-marks"],
    ["emphasis nested 12 deep", `${"*a _b ".repeat(6)}x${" b_ a*".repeat(6)}`, "nesting"],
    ["a link in strong emphasis nested 10 deep", `${"**a ".repeat(10)}[x](https://example.org)${" a**".repeat(10)}`, "nesting"],
    ["6,666 unmatched emphasis closers in one paragraph", "a* ".repeat(6666), "emphasis-marks"],
    ["1,001 list items", lines(1001, () => "- a"), "list-items"],
    ["8,000 elements in 2,000 paragraphs", "*a* b\n\n".repeat(2000), "elements"],
    ["20,001 characters", "a".repeat(20_001), "characters"],
  ])("refuse %s, and a sheet prints a notice in its place", (_, markdown, limit) => {
    expect(findProseLimitBreach(markdown)?.limit).toBe(limit);
    const { html, blocks, breach } = renderProse(markdown);
    expect(breach?.limit).toBe(limit);
    expect(blocks).toEqual([{ type: "paragraph", children: [{ type: "text", value: expect.stringMatching(/^This section is not shown: it .+ to show it\.$/) }] }]);
    expect(html).toMatch(/^<p>This section is not shown: it [^<]+<\/p>$/);
  });

  it("take long flat text: 20,000 characters of brackets, and as many in ordinary sentences", () => {
    expect(renderProse("[".repeat(20_000)).blocks).toEqual([{ type: "paragraph", children: [{ type: "text", value: "[".repeat(20_000) }] }]);
    const sentences = "A **passive** doubler with `code` and a [note](https://example.org).\n\n".repeat(280);
    expect(sentences.length).toBeLessThanOrEqual(proseLimits.maxCharacters);
    expect(findProseLimitBreach(sentences)).toBeNull();
  });

  it("hold for every template's default text and the demo sheets' prose", () => {
    const texts = [
      ...[frequencyMultiplierTemplate, doubleBalancedMixerTemplate, quadratureHybridTemplate, combGeneratorTemplate].flatMap((template) =>
        template.prose.map((section) => section.markdown),
      ),
      ...Object.values(demoSheets).flatMap((sheet) => Object.values(sheet.prose)),
    ];
    expect(texts.length).toBeGreaterThan(10);
    for (const text of texts) expect(findProseLimitBreach(text!), text).toBeNull();
  });
});

describe("saving prose over a limit", () => {
  it("is refused with the section and the limit named", () => {
    const deep = sheetContentBodySchema.safeParse({ prose: { description: "fine", features: `${"> ".repeat(11)}x` } });
    expect(deep.success).toBe(false);
    expect(deep.error!.issues).toHaveLength(1);
    expect(deep.error!.issues[0].path).toEqual(["prose", "features"]);
    expect(deep.error!.issues[0].message).toBe(
      "The section “Key features” nests quotes, lists or emphasis more than 10 levels deep; flatten it to 10 levels or fewer.",
    );
    const long = sheetContentBodySchema.safeParse({ prose: { "test-fixture": "a".repeat(20_001) } });
    expect(long.error!.issues[0].message).toBe("The section “Test fixture” is longer than 20,000 characters; shorten it.");
    expect(sheetContentBodySchema.safeParse({ prose: { features: "- one\n  - two\n    > **three**" } }).success).toBe(true);
  });
});

describe("a stored section over a limit", () => {
  const input = loadDoublerInput();
  const hostile = { ...input, prose: { ...input.prose, applications: `${">".repeat(5000)} x`, features: "- a\n".repeat(1001) } };

  it("becomes a notice in the model, with a review note, and the model still serializes", () => {
    const model = buildSheetModel(hostile);
    const applications = model.prose.find((section) => section.id === "applications")!;
    expect(applications.blocks[0]).toMatchObject({ type: "paragraph" });
    expect(JSON.stringify(applications.blocks)).toContain("This section is not shown: it nests quotes, lists or emphasis more than 10 levels deep");
    expect(model.issues).toContainEqual({
      code: "prose-over-limit",
      message: "The section “Applications” is not shown: it nests quotes, lists or emphasis more than 10 levels deep.",
    });
    expect(model.issues).toContainEqual({ code: "prose-over-limit", message: "The section “Key features” is not shown: it has more than 1,000 list items." });
    expect(serializeSheetModel(model)).toContain("This section is not shown");
  });

  it("leaves the web page whole", () => {
    const html = renderToStaticMarkup(createElement(SheetView, { model: buildSheetModel(hostile) }));
    expect(html).toContain("This section is not shown");
    expect(html).toContain("Electrical specifications");
  });
});

describe("SheetProse", () => {
  it("draws a hand-made model nested 5,000 levels deep only down to the prose limit, without overflowing the stack", () => {
    let blocks: ProseBlock[] = [{ type: "paragraph", children: [{ type: "text", value: "at the bottom" }] }];
    for (let i = 0; i < 5000; i++) blocks = i % 2 ? [{ type: "quote", children: blocks }] : [{ type: "list", ordered: false, items: [blocks] }];
    const html = renderToStaticMarkup(createElement(SheetProse, { blocks }));
    expect(html).toContain("[nested too deeply to show]");
    expect(html).not.toContain("at the bottom");
    expect(html.match(/<blockquote/g)!.length + html.match(/<ul/g)!.length).toBe(proseLimits.maxNestingDepth + 1);
  });
});
