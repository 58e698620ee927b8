import type { Element, ElementContent, Root, RootContent } from "hast";
import rehypeSanitize from "rehype-sanitize";
import rehypeStringify from "rehype-stringify";
import remarkParse from "remark-parse";
import remarkRehype from "remark-rehype";
import { unified } from "unified";
import { checkProseSource, checkProseTree, type ProseLimitBreach } from "./prose-limits";
import type { ProseBlock, ProseInline } from "./types";

/** No raw HTML: remark-rehype drops it (no allowDangerousHtml), and rehype-sanitize's GitHub schema cleans the rest. */
const processor = unified().use(remarkParse).use(remarkRehype).use(rehypeSanitize).use(rehypeStringify);

export interface RenderedProse {
  html: string;
  blocks: ProseBlock[];
  /** Set when the section is over a limit (proseLimits): html and blocks then carry a notice in its place. */
  breach?: ProseLimitBreach;
}

/**
 * Markdown → sanitized HTML (for API consumers) and, from the same sanitized
 * tree, the small block/inline structure both sheet renderers draw. A section
 * over a limit is never handed to the recursive steps (mdast → hast, sanitize,
 * stringify, the block tree): a plain notice takes its place, so text stored
 * before the limits existed cannot break the sheet.
 */
export function renderProse(markdown: string): RenderedProse {
  let breach = checkProseSource(markdown);
  const mdast = breach ? null : processor.parse(markdown);
  if (mdast) breach = checkProseTree(mdast);
  if (breach || !mdast) return overLimit(breach!);
  const tree = processor.runSync(mdast) as Root;
  const html = String(processor.stringify(tree)).trim();
  return { html, blocks: toBlocks(tree.children) };
}

/** The first limit a section's markdown breaks, or null: checked when prose is saved. */
export function findProseLimitBreach(markdown: string): ProseLimitBreach | null {
  return checkProseSource(markdown) ?? checkProseTree(processor.parse(markdown));
}

/** What a sheet prints in place of a section over a limit. */
export function proseOverLimitNotice(breach: ProseLimitBreach): string {
  return `This section is not shown: it ${breach.reason}; ${breach.remedy} to show it.`;
}

function overLimit(breach: ProseLimitBreach): RenderedProse {
  const notice = proseOverLimitNotice(breach);
  const html = `<p>${notice.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;")}</p>`;
  return { html, blocks: [{ type: "paragraph", children: [{ type: "text", value: notice }] }], breach };
}

/** Plain text of inline content, for alt texts and tests. */
export function proseToPlainText(blocks: ProseBlock[]): string {
  const inline = (nodes: ProseInline[]): string =>
    nodes
      .map((node) => {
        switch (node.type) {
          case "text":
          case "code":
            return node.value;
          case "break":
            return "\n";
          default:
            return inline(node.children);
        }
      })
      .join("");
  return blocks
    .map((block) => {
      switch (block.type) {
        case "paragraph":
        case "heading":
          return inline(block.children);
        case "code":
          return block.value;
        case "quote":
          return proseToPlainText(block.children);
        case "list":
          return block.items.map((item) => proseToPlainText(item)).join("\n");
      }
    })
    .join("\n\n");
}

function toBlocks(nodes: (RootContent | ElementContent)[]): ProseBlock[] {
  const blocks: ProseBlock[] = [];
  let loose: ProseInline[] = [];
  const flushLoose = () => {
    const trimmed = trimInlines(loose);
    if (trimmed.length > 0) blocks.push({ type: "paragraph", children: trimmed });
    loose = [];
  };
  for (const node of nodes) {
    if (node.type !== "element") {
      if (node.type === "text") loose.push({ type: "text", value: node.value });
      continue;
    }
    const block = toBlock(node);
    if (block === "inline") {
      loose.push(...toInlines([node]));
      continue;
    }
    flushLoose();
    if (block) blocks.push(...block);
  }
  flushLoose();
  return blocks;
}

function toBlock(node: Element): ProseBlock[] | "inline" | null {
  switch (node.tagName) {
    case "p":
      return [{ type: "paragraph", children: trimInlines(toInlines(node.children)) }];
    case "h1":
    case "h2":
    case "h3":
    case "h4":
    case "h5":
    case "h6":
      return [{ type: "heading", children: trimInlines(toInlines(node.children)) }];
    case "ul":
    case "ol":
      return [
        {
          type: "list",
          ordered: node.tagName === "ol",
          items: node.children
            .filter((child): child is Element => child.type === "element" && child.tagName === "li")
            .map((item) => toBlocks(item.children)),
        },
      ];
    case "pre":
      return [{ type: "code", value: textOf(node).replace(/\n$/, "") }];
    case "blockquote":
      return [{ type: "quote", children: toBlocks(node.children) }];
    case "hr":
    case "img":
      return null;
    case "div":
    case "section":
    case "table":
    case "thead":
    case "tbody":
    case "tr":
    case "td":
    case "th":
    case "details":
    case "summary":
    case "dl":
    case "dt":
    case "dd":
      return toBlocks(node.children);
    default:
      return "inline";
  }
}

function toInlines(nodes: ElementContent[]): ProseInline[] {
  const out: ProseInline[] = [];
  for (const node of nodes) {
    if (node.type === "text") {
      out.push({ type: "text", value: node.value });
      continue;
    }
    if (node.type !== "element") continue;
    switch (node.tagName) {
      case "strong":
      case "b":
        out.push({ type: "strong", children: toInlines(node.children) });
        break;
      case "em":
      case "i":
        out.push({ type: "emphasis", children: toInlines(node.children) });
        break;
      case "code":
        out.push({ type: "code", value: textOf(node) });
        break;
      case "br":
        out.push({ type: "break" });
        break;
      case "a": {
        const href = node.properties?.href;
        const children = toInlines(node.children);
        // The sanitizer keeps only safe protocols; anything left without an href is plain text.
        if (typeof href === "string" && /^(https?:|mailto:)/i.test(href)) out.push({ type: "link", href, children });
        else out.push(...children);
        break;
      }
      case "img": {
        const alt = node.properties?.alt;
        if (typeof alt === "string" && alt) out.push({ type: "text", value: alt });
        break;
      }
      default:
        out.push(...toInlines(node.children));
    }
  }
  return mergeText(out);
}

function mergeText(nodes: ProseInline[]): ProseInline[] {
  const merged: ProseInline[] = [];
  for (const node of nodes) {
    const last = merged[merged.length - 1];
    if (node.type === "text" && last?.type === "text") merged[merged.length - 1] = { type: "text", value: last.value + node.value };
    else merged.push(node);
  }
  return merged;
}

function trimInlines(nodes: ProseInline[]): ProseInline[] {
  const out = mergeText(nodes).map((n) => (n.type === "text" ? { ...n, value: n.value.replace(/\s*\n\s*/g, " ") } : n));
  if (out[0]?.type === "text") out[0] = { type: "text", value: out[0].value.trimStart() };
  const last = out[out.length - 1];
  if (last?.type === "text") out[out.length - 1] = { type: "text", value: last.value.trimEnd() };
  return out.filter((n) => n.type !== "text" || n.value !== "");
}

function textOf(node: Element | ElementContent): string {
  if (node.type === "text") return node.value;
  if (node.type !== "element") return "";
  return node.children.map(textOf).join("");
}
