/**
 * Unit u of an invented lot: a Touchstone file (RI data) with every |S| scaled by (1 + 0.03·u) and
 * every phase turned by 7°·u, keeping its comments and option line. Four such units make an even
 * count, whose median is the mean of the middle two.
 */
export function perturbedNetwork(example: string, u: number): string {
  const scale = 1 + 0.03 * u;
  const turn = (7 * u * Math.PI) / 180;
  const lines = example.split("\n").map((line) => {
    if (line.startsWith("!") || line.startsWith("#") || !line.trim()) return line;
    const cells = line.trim().split(/\s+/).map(Number);
    const head = cells.length % 2 === 1 ? [cells.shift()!] : [];
    const out: number[] = [];
    for (let i = 0; i < cells.length; i += 2) {
      const [re, im] = [cells[i], cells[i + 1]];
      out.push(scale * (re * Math.cos(turn) - im * Math.sin(turn)), scale * (re * Math.sin(turn) + im * Math.cos(turn)));
    }
    return [...head, ...out].join(" ");
  });
  return `${lines.join("\n")}\n! unit ${u}\n`;
}
