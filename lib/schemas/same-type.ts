/**
 * True when each of A and B is assignable to the other: a response schema's inferred type and the
 * domain type a handler returns. `const check: Same<z.infer<typeof s>, T> = true` fails the type
 * check when a field is added, dropped or changes type on either side.
 */
export type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
