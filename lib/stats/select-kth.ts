/** Order statistics without a full sort. */

/**
 * The k-th lowest (from 0) of values[0…size), partially reordering them so that values[0…k) are ≤
 * it and values(k…size) ≥ it (Hoare's FIND, "Algorithm 65: Find", CACM 4(7), 1961, middle pivot).
 */
export function selectKth(values: Float64Array, size: number, k: number): number {
  let left = 0;
  let right = size - 1;
  while (left < right) {
    const pivot = values[(left + right) >> 1];
    let i = left;
    let j = right;
    while (i <= j) {
      while (values[i] < pivot) i++;
      while (values[j] > pivot) j--;
      if (i <= j) {
        const t = values[i];
        values[i] = values[j];
        values[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else break;
  }
  return values[k];
}

/** The median of values[0…size) (the mean of the two middle values for an even count), reordering them. */
export function medianInPlace(values: Float64Array, size: number): number {
  const middle = size >> 1;
  const upper = selectKth(values, size, middle);
  if (size % 2 === 1) return upper;
  // After selection everything left of `middle` is ≤ its value: the lower middle is their maximum.
  let lower = values[0];
  for (let j = 1; j < middle; j++) if (values[j] > lower) lower = values[j];
  return (lower + upper) / 2;
}
