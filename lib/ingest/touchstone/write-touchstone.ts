/**
 * A Touchstone 1.1 file (IBIS Open Forum, Touchstone File Format Specification, Version 1.1, 2002)
 * in dB/angle format: "# Hz S DB R <ohms>", frequency first, each S(i, j) as magnitude in dB and
 * angle in degrees. A 2-port lists S11 S21 S12 S22 on one line (§ "2-port data"); 3 ports and more
 * list the matrix row by row, each row on lines of at most four pairs (§ "Multi-port data").
 * The reader in this folder reads it back; so does any other Touchstone reader.
 */

export type DbAngleNetwork = {
  portCount: number;
  frequencyHz: ArrayLike<number>;
  /** Entry-major: S(i, j) at every frequency, then the next entry. */
  magnitudeDb: ArrayLike<number>;
  phaseDeg: ArrayLike<number>;
  referenceOhm: number;
};

/** Shortest text that reads back as the same double (JavaScript's own round trip). */
const figure = (x: number) => (Object.is(x, -0) ? "0" : String(x));

export function writeTouchstone(network: DbAngleNetwork, comments: string[] = []): string {
  const n = network.portCount;
  const f = network.frequencyHz.length;
  const lines = comments.map((c) => `! ${c.replace(/[\r\n]+/g, " ")}`);
  lines.push(`# Hz S DB R ${figure(network.referenceOhm)}`);
  const pair = (i: number, j: number, k: number) => {
    const e = (i * n + j) * f + k;
    return `${figure(network.magnitudeDb[e])} ${figure(network.phaseDeg[e])}`;
  };
  for (let k = 0; k < f; k++) {
    const freq = figure(network.frequencyHz[k]);
    if (n === 1) lines.push(`${freq} ${pair(0, 0, k)}`);
    else if (n === 2) lines.push(`${freq} ${pair(0, 0, k)} ${pair(1, 0, k)} ${pair(0, 1, k)} ${pair(1, 1, k)}`);
    else {
      for (let i = 0; i < n; i++) {
        for (let j0 = 0; j0 < n; j0 += 4) {
          const cells = [];
          for (let j = j0; j < Math.min(n, j0 + 4); j++) cells.push(pair(i, j, k));
          lines.push(`${i === 0 && j0 === 0 ? freq : " ".repeat(freq.length)} ${cells.join(" ")}`);
        }
      }
    }
  }
  return `${lines.join("\n")}\n`;
}
