import { describe, expect, it } from "vitest";
import { proseToPlainText, renderProse } from "@/lib/sheet";

describe("renderProse", () => {
  it("renders markdown to sanitized HTML and the same content as blocks", () => {
    const { html, blocks } = renderProse("Some **bold** text with `code`.\n\n- one\n- two µm\n\n1. first");
    expect(html).toContain("<strong>bold</strong>");
    expect(html).toContain("<li>two µm</li>");
    expect(blocks.map((b) => b.type)).toEqual(["paragraph", "list", "list"]);
    expect(blocks[1]).toMatchObject({ type: "list", ordered: false });
    expect(blocks[2]).toMatchObject({ type: "list", ordered: true });
    expect(proseToPlainText(blocks)).toContain("Some bold text with code.");
  });

  it.each([
    ["raw script", "<script>alert(1)</script>Hello", "script"],
    ["inline handler", '<img src="x" onerror="alert(1)">', "onerror"],
    ["javascript link", "[click](javascript:alert(1))", "javascript:"],
  ])("drops %s", (_, markdown, forbidden) => {
    const { html, blocks } = renderProse(markdown);
    expect(html.toLowerCase()).not.toContain(forbidden);
    expect(JSON.stringify(blocks).toLowerCase()).not.toContain(forbidden);
  });

  it("keeps safe links as link nodes", () => {
    const { blocks } = renderProse("See [the note](https://example.org/note).");
    expect(blocks[0]).toEqual({
      type: "paragraph",
      children: [{ type: "text", value: "See " }, { type: "link", href: "https://example.org/note", children: [{ type: "text", value: "the note" }] }, { type: "text", value: "." }],
    });
  });
});
