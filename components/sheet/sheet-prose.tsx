import { proseTooDeep, proseTooDeepText } from "@/lib/sheet/prose-limits";
import type { ProseBlock, ProseInline } from "@/lib/sheet/types";

function Inlines({ nodes, depth }: { nodes: ProseInline[]; depth: number }) {
  if (proseTooDeep(depth)) return proseTooDeepText;
  return (
    <>
      {nodes.map((node, i) => {
        switch (node.type) {
          case "text":
            return node.value;
          case "break":
            return <br key={i} />;
          case "code":
            return <code key={i}>{node.value}</code>;
          case "strong":
            return (
              <strong key={i}>
                <Inlines nodes={node.children} depth={depth + 1} />
              </strong>
            );
          case "emphasis":
            return (
              <em key={i}>
                <Inlines nodes={node.children} depth={depth + 1} />
              </em>
            );
          case "link":
            return (
              <a key={i} href={node.href} rel="noopener noreferrer nofollow">
                <Inlines nodes={node.children} depth={depth + 1} />
              </a>
            );
        }
      })}
    </>
  );
}

/** The sheet model's prose blocks as React elements: the same tree the PDF draws, no raw HTML. */
export function SheetProse({ blocks, depth = 0 }: { blocks: ProseBlock[]; depth?: number }) {
  if (proseTooDeep(depth)) return <p className="mb-2 text-ink-muted">{proseTooDeepText}</p>;
  return (
    <>
      {blocks.map((block, i) => {
        switch (block.type) {
          case "paragraph":
            return (
              <p key={i} className="mb-2">
                <Inlines nodes={block.children} depth={depth} />
              </p>
            );
          case "heading":
            return (
              <h4 key={i} className="mt-3 mb-1 font-semibold">
                <Inlines nodes={block.children} depth={depth} />
              </h4>
            );
          case "code":
            return (
              <pre key={i} className="mb-2 overflow-x-auto text-sm">
                <code>{block.value}</code>
              </pre>
            );
          case "quote":
            return (
              <blockquote key={i} className="mb-2 border-l border-rule pl-3">
                <SheetProse blocks={block.children} depth={depth + 1} />
              </blockquote>
            );
          case "list": {
            const List = block.ordered ? "ol" : "ul";
            return (
              <List key={i} className={`mb-2 pl-5 ${block.ordered ? "list-decimal" : "list-disc"}`}>
                {block.items.map((item, j) => (
                  <li key={j} className="mb-1">
                    <SheetProse blocks={item} depth={depth + 1} />
                  </li>
                ))}
              </List>
            );
          }
        }
      })}
    </>
  );
}
