import "server-only";
import bcrypt from "bcryptjs";

/**
 * The bcrypt cost of every stored password: 11, or BENCHFOLD_PASSWORD_HASH_COST (4 to 15). The
 * sign-in decoy (auth-options.ts) uses the same cost, so a failed sign-in takes as long for an
 * unknown address as for a wrong password. Only `npm test` sets it (5): bcryptjs takes about a
 * second at 11 on the shared 2-core machine, and the suite signs in hundreds of times. OWASP's
 * Password Storage Cheat Sheet asks for 10 or more in production.
 */
export const passwordHashCost = readPasswordHashCost(process.env.BENCHFOLD_PASSWORD_HASH_COST);

export function readPasswordHashCost(value: string | undefined): number {
  if (value === undefined || value === "") return 11;
  const cost = Number(value);
  if (!/^\d+$/.test(value) || cost < 4 || cost > 15) {
    throw new Error(`BENCHFOLD_PASSWORD_HASH_COST must be a whole number from 4 to 15 (it is "${value}")`);
  }
  return cost;
}

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, passwordHashCost);
}

/**
 * Whether a stored hash was made at a lower cost than today's (raised since, or seeded cheaper):
 * sign-in then stores a new hash of the password it has just checked (OWASP Password Storage
 * Cheat Sheet, "Upgrading the work factor"). A higher cost is left alone. A hash bcryptjs cannot
 * read is not rehashed here: it cannot have matched.
 */
export function needsRehash(passwordHash: string): boolean {
  try {
    return bcrypt.getRounds(passwordHash) < passwordHashCost;
  } catch {
    return false;
  }
}
