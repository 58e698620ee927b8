import { formatNumber, NBSP } from "./quantity";

/** A file size in 1024-byte steps, one decimal: "1.5 MB", "812.0 kB", "95 bytes". */
export function formatByteSize(bytes: number, style: { plain?: boolean } = {}): string {
  const space = style.plain ? " " : NBSP;
  if (bytes >= 1024 * 1024) return `${formatNumber(bytes / (1024 * 1024), { digits: { decimals: 1 }, ...style })}${space}MB`;
  if (bytes >= 1024) return `${formatNumber(bytes / 1024, { digits: { decimals: 1 }, ...style })}${space}kB`;
  return `${formatNumber(bytes, { digits: { decimals: 0 }, ...style })}${space}bytes`;
}
