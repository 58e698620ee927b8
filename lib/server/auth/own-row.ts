import "server-only";
import type { Attributes, Model, ModelStatic, Transaction, WhereOptions } from "sequelize";
import { AppError } from "@/lib/errors";

/**
 * The resource-level rule every edit starts with: the row `id` of the actor's own organization,
 * locked for update in `transaction`, or "not-found" (`No such <noun> in your organization.`),
 * the same answer whether the row is missing or another organization's, so ids tell nothing.
 */
export async function lockOwnRow<M extends Model & { id: number; organizationId: number }>(
  model: ModelStatic<M>,
  id: number,
  actor: { organizationId: number },
  transaction: Transaction,
  noun: string,
): Promise<M> {
  // Sequelize cannot see through the generic that these two attributes exist; the bound on M says they do.
  const where = { id, organizationId: actor.organizationId } as unknown as WhereOptions<Attributes<M>>;
  const row = await model.findOne({ where, lock: transaction.LOCK.UPDATE, transaction });
  if (!row) throw new AppError("not-found", `No such ${noun} in your organization.`);
  return row;
}
