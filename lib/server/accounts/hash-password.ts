import "server-only";
import bcrypt from "bcryptjs";

/**
 * The bcrypt cost of every stored password. The sign-in decoy (auth-options.ts) uses the same
 * cost, so a failed sign-in takes as long for an unknown address as for a wrong password.
 */
export const passwordHashCost = 11;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, passwordHashCost);
}
