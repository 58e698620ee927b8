import "server-only";
import { Link, StyleSheet, Text, View } from "@react-pdf/renderer";
import type { ReactNode } from "react";
import { tokens } from "../../design/tokens";
import { notationSegments } from "../../sheet/notation";
import { proseTooDeep, proseTooDeepText } from "../../sheet/prose-limits";
import type { ProseBlock, ProseInline } from "../../sheet/types";
import { MONO_FAMILY, SANS_FAMILY } from "./fonts";

export const colors = tokens.colors;

export const styles = StyleSheet.create({
  sectionHeading: {
    fontFamily: SANS_FAMILY,
    fontWeight: 600,
    fontSize: 8.5,
    letterSpacing: 0.9,
    textTransform: "uppercase",
    color: colors.ink,
    marginTop: 14,
    marginBottom: 5,
    paddingBottom: 2,
    borderBottomWidth: 1.2,
    borderBottomColor: colors.ink,
  },
  subHeading: { fontWeight: 600, fontSize: 9, marginTop: 6, marginBottom: 3 },
  paragraph: { marginBottom: 4 },
  muted: { color: colors["ink-muted"] },
  small: { fontSize: 7.5, color: colors["ink-muted"] },
  mono: { fontFamily: MONO_FAMILY, fontSize: 7.6 },
  listItem: { flexDirection: "row", marginBottom: 2 },
  bullet: { width: 10, color: colors["ink-muted"] },
  table: { borderTopWidth: 1.2, borderTopColor: colors.ink, borderBottomWidth: 1.2, borderBottomColor: colors.ink },
  headRow: { flexDirection: "row", borderBottomWidth: 0.6, borderBottomColor: colors["rule-strong"], paddingVertical: 3 },
  headCell: { fontSize: 6.4, fontWeight: 600, letterSpacing: 0.3, textTransform: "uppercase", color: colors["ink-muted"], paddingRight: 4 },
  row: { flexDirection: "row", borderTopWidth: 0.4, borderTopColor: colors.rule, paddingVertical: 2.6 },
  firstRow: { flexDirection: "row", paddingVertical: 2.6 },
  cell: { fontSize: 7.8, paddingRight: 4 },
});

export function SectionHeading({ children }: { children: ReactNode }) {
  return (
    <Text style={styles.sectionHeading} minPresenceAhead={60}>
      {children}
    </Text>
  );
}

export interface Column {
  header: string;
  width: `${number}%`;
  align?: "left" | "right";
  mono?: boolean;
}

/** A table in the printer's manner: strong top and bottom rules, hairlines between rows, the head repeated on each page. */
/** A cell is one line, or several lines given as an array (never "\n" inside a Text: the line break falls back to Helvetica). */
export type Cell = ReactNode | ReactNode[];

/** A model string in the sheet's notation ("T_A", "P_opt"): the subscript set smaller (lib/sheet/notation.ts). */
export function PdfNotation({ text, subSize = 5.6 }: { text: string; subSize?: number }) {
  return (
    <>
      {notationSegments(text).map((segment, i) =>
        segment.sub === undefined ? (
          segment.text
        ) : (
          <Text key={i}>
            {segment.text}
            <Text style={{ fontSize: subSize, verticalAlign: "sub" }}>{segment.sub}</Text>
          </Text>
        ),
      )}
    </>
  );
}

export function PdfTable({ columns, rows }: { columns: Column[]; rows: Cell[][] }) {
  return (
    <View style={styles.table}>
      <View style={styles.headRow} fixed>
        {columns.map((column, i) => (
          <Text key={i} style={[styles.headCell, { width: column.width, textAlign: column.align ?? "left" }]}>
            <PdfNotation text={column.header} subSize={5.2} />
          </Text>
        ))}
      </View>
      {rows.map((cells, r) => (
        <View key={r} style={r === 0 ? styles.firstRow : styles.row} wrap={false}>
          {cells.map((cell, i) => {
            const column = columns[i];
            if (!Array.isArray(cell)) {
              return (
                <Text key={i} style={[styles.cell, column.mono ? styles.mono : {}, { width: column.width, textAlign: column.align ?? "left" }]}>
                  {cell}
                </Text>
              );
            }
            return (
              <View key={i} style={{ width: column.width }}>
                {(Array.isArray(cell) ? cell : [cell]).map((line, j) => (
                  <Text key={j} style={[styles.cell, column.mono ? styles.mono : {}, { textAlign: column.align ?? "left" }]}>
                    {line}
                  </Text>
                ))}
              </View>
            );
          })}
        </View>
      ))}
    </View>
  );
}

function Inlines({ nodes, depth }: { nodes: ProseInline[]; depth: number }) {
  if (proseTooDeep(depth)) return proseTooDeepText;
  return (
    <>
      {nodes.map((node, i) => {
        switch (node.type) {
          case "text":
            return node.value;
          case "break":
            return null;
          case "code":
            return (
              <Text key={i} style={styles.mono}>
                {node.value}
              </Text>
            );
          case "strong":
            return (
              <Text key={i} style={{ fontWeight: 600 }}>
                <Inlines nodes={node.children} depth={depth + 1} />
              </Text>
            );
          case "emphasis":
            return (
              <Text key={i} style={{ fontStyle: "italic" }}>
                <Inlines nodes={node.children} depth={depth + 1} />
              </Text>
            );
          case "link":
            return (
              <Link key={i} src={node.href} style={{ color: colors.ink }}>
                <Inlines nodes={node.children} depth={depth + 1} />
              </Link>
            );
        }
      })}
    </>
  );
}

/** Hard line breaks become separate lines: a "\n" inside a Text is drawn with a fallback font. */
function splitAtBreaks(nodes: ProseInline[]): ProseInline[][] {
  const lines: ProseInline[][] = [[]];
  for (const node of nodes) {
    if (node.type === "break") lines.push([]);
    else lines[lines.length - 1].push(node);
  }
  return lines;
}

/** The sheet model's prose blocks, drawn with react-pdf primitives (the PDF cannot draw HTML). */
export function PdfProse({ blocks, depth = 0 }: { blocks: ProseBlock[]; depth?: number }) {
  if (proseTooDeep(depth)) return <Text style={[styles.paragraph, styles.muted]}>{proseTooDeepText}</Text>;
  return (
    <>
      {blocks.map((block, i) => {
        switch (block.type) {
          case "paragraph":
            return (
              <View key={i} style={styles.paragraph}>
                {splitAtBreaks(block.children).map((line, j) => (
                  <Text key={j}>
                    <Inlines nodes={line} depth={depth} />
                  </Text>
                ))}
              </View>
            );
          case "heading":
            return (
              <Text key={i} style={styles.subHeading}>
                <Inlines nodes={block.children} depth={depth} />
              </Text>
            );
          case "code":
            return (
              <Text key={i} style={[styles.mono, styles.paragraph]}>
                {block.value}
              </Text>
            );
          case "quote":
            return (
              <View key={i} style={{ paddingLeft: 8, borderLeftWidth: 1, borderLeftColor: colors.rule }}>
                <PdfProse blocks={block.children} depth={depth + 1} />
              </View>
            );
          case "list":
            return (
              <View key={i} style={styles.paragraph}>
                {block.items.map((item, j) => (
                  <View key={j} style={styles.listItem} wrap={false}>
                    <Text style={styles.bullet}>{block.ordered ? `${j + 1}.` : "•"}</Text>
                    <View style={{ flex: 1 }}>
                      <PdfProse blocks={item} depth={depth + 1} />
                    </View>
                  </View>
                ))}
              </View>
            );
        }
      })}
    </>
  );
}
