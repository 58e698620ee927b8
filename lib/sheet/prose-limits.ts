import type { Nodes as MdastNodes, Root as MdastRoot } from "mdast";

/**
 * What one prose section of a sheet may contain. Far above what a datasheet needs; below what
 * the markdown pipeline, the web page and the PDF layout can take: the markdown-to-HTML steps
 * and the PDF layout engine recurse once per nesting level (5,000 nested quotes overflowed the
 * stack; 1,000 broke the PDF layout), and the parser's time grows with the square of some inputs.
 */
export const proseLimits = {
  /** Markdown characters per section. */
  maxCharacters: 20_000,
  /** Quotes, lists, emphasis and links inside one another. */
  maxNestingDepth: 10,
  /** Elements of the parsed section: paragraphs, list items, emphasis, links, runs of text. */
  maxElements: 5_000,
  /** List items: the parser's time per item is the largest of any element. */
  maxListItems: 1_000,
  /** `*` and `_` in one paragraph: the parser pairs emphasis marks in time that grows with their square. */
  maxEmphasisMarksPerParagraph: 1_000,
} as const;

/**
 * Whether a renderer at this nesting depth (0 at a section's top level) must stop recursing. The
 * model's prose is within proseLimits when renderProse made it; a model from elsewhere (a stored
 * release, a hand-made one) still never makes the web page or the PDF recurse deeper than that:
 * react-pdf's layout engine broke for the whole process on about 800 nested views.
 */
export function proseTooDeep(depth: number): boolean {
  return depth > proseLimits.maxNestingDepth;
}

/** What a renderer shows instead of prose nested deeper than {@link proseTooDeep} allows. */
export const proseTooDeepText = "[nested too deeply to show]";

export type ProseLimit = "characters" | "nesting" | "elements" | "list-items" | "emphasis-marks";

export interface ProseLimitBreach {
  limit: ProseLimit;
  /** What is wrong, as a clause after the section's name: "nests quotes, … more than 10 levels deep". */
  reason: string;
  /** What to do about it: "flatten it to 10 levels or fewer". */
  remedy: string;
}

const number = (n: number) => n.toLocaleString("en-US");

const breaches: Record<ProseLimit, ProseLimitBreach> = {
  characters: {
    limit: "characters",
    reason: `is longer than ${number(proseLimits.maxCharacters)} characters`,
    remedy: "shorten it",
  },
  nesting: {
    limit: "nesting",
    reason: `nests quotes, lists or emphasis more than ${proseLimits.maxNestingDepth} levels deep`,
    remedy: `flatten it to ${proseLimits.maxNestingDepth} levels or fewer`,
  },
  elements: {
    limit: "elements",
    reason: `has more than ${number(proseLimits.maxElements)} elements (paragraphs, list items, emphasis, links)`,
    remedy: "shorten it or split its lists",
  },
  "list-items": {
    limit: "list-items",
    reason: `has more than ${number(proseLimits.maxListItems)} list items`,
    remedy: "shorten its lists",
  },
  "emphasis-marks": {
    limit: "emphasis-marks",
    reason: `has a paragraph with more than ${number(proseLimits.maxEmphasisMarksPerParagraph)} emphasis marks (* or _)`,
    remedy: "use fewer of them in one paragraph",
  },
};

// The lexical bound on nesting below may overcount (deeply indented code counts too); it only
// guards the parser's time, so it refuses far above the real limit, which the parsed tree checks.
const LEXICAL_NESTING_GUARD = 10 * proseLimits.maxNestingDepth;

/**
 * Checks the markdown text before it is parsed, in one pass over its characters: its length, an
 * upper bound on how deep any line can nest (container markers at its start plus half its
 * indentation: a nested list item needs at least two columns more than its parent's), the list
 * markers (at least one per list item), and the emphasis marks per paragraph (text between blank lines).
 */
export function checkProseSource(markdown: string): ProseLimitBreach | null {
  if (markdown.length > proseLimits.maxCharacters) return breaches.characters;
  const prefix = { depth: 0, listMarkers: 0 };
  let listItems = 0;
  let marks = 0;
  let lineStart = 0;
  while (lineStart <= markdown.length) {
    let lineEnd = markdown.indexOf("\n", lineStart);
    if (lineEnd < 0) lineEnd = markdown.length;
    readLinePrefix(markdown, lineStart, lineEnd, prefix);
    if (prefix.depth > LEXICAL_NESTING_GUARD) return breaches.nesting;
    listItems += prefix.listMarkers;
    if (listItems > proseLimits.maxListItems) return breaches["list-items"];
    let blank = true;
    for (let i = lineStart; i < lineEnd; i++) {
      const c = markdown.charCodeAt(i);
      if (c === STAR || c === UNDERSCORE) marks++;
      if (c !== SPACE && c !== TAB && c !== CR) blank = false;
    }
    if (blank) marks = 0;
    else if (marks > proseLimits.maxEmphasisMarksPerParagraph) return breaches["emphasis-marks"];
    lineStart = lineEnd + 1;
  }
  return null;
}

const SPACE = 0x20;
const TAB = 0x09;
const CR = 0x0d;
const STAR = 0x2a;
const UNDERSCORE = 0x5f;
const GT = 0x3e;
const PLUS = 0x2b;
const MINUS = 0x2d;
const DOT = 0x2e;
const PAREN = 0x29;

/** The container markers (quote and list) at a line's start, and half its indentation. */
function readLinePrefix(text: string, start: number, end: number, out: { depth: number; listMarkers: number }): void {
  let i = start;
  let columns = 0;
  let quotes = 0;
  let lists = 0;
  const followedBySpace = (j: number) => j >= end || text.charCodeAt(j) === SPACE || text.charCodeAt(j) === TAB || text.charCodeAt(j) === CR;
  while (i < end) {
    const c = text.charCodeAt(i);
    if (c === SPACE) {
      columns++;
      i++;
    } else if (c === TAB) {
      columns += 4 - (columns % 4);
      i++;
    } else if (c === GT) {
      quotes++;
      i++;
    } else if ((c === MINUS || c === PLUS || c === STAR) && followedBySpace(i + 1)) {
      lists++;
      i++;
    } else if (c >= 0x30 && c <= 0x39) {
      let j = i;
      while (j < end && j - i < 9 && text.charCodeAt(j) >= 0x30 && text.charCodeAt(j) <= 0x39) j++;
      const d = text.charCodeAt(j);
      if (j < end && (d === DOT || d === PAREN) && followedBySpace(j + 1)) {
        lists++;
        i = j + 1;
      } else break;
    } else break;
  }
  out.depth = quotes + lists + Math.floor(columns / 2);
  out.listMarkers = lists;
}

const nestingTypes = new Set<MdastNodes["type"]>(["blockquote", "list", "emphasis", "strong", "delete", "link", "linkReference"]);

/**
 * Checks the parsed markdown (mdast) before anything recursive walks it: nesting depth and element
 * count, counted with an explicit stack so that no input can overflow this check itself.
 */
export function checkProseTree(root: MdastRoot): ProseLimitBreach | null {
  let elements = 0;
  const stack: { node: MdastNodes; depth: number }[] = root.children.map((node) => ({ node, depth: 0 }));
  while (stack.length > 0) {
    const { node, depth: outer } = stack.pop()!;
    const depth = nestingTypes.has(node.type) ? outer + 1 : outer;
    if (depth > proseLimits.maxNestingDepth) return breaches.nesting;
    if (++elements > proseLimits.maxElements) return breaches.elements;
    if ("children" in node) for (const child of node.children) stack.push({ node: child, depth });
  }
  return null;
}
