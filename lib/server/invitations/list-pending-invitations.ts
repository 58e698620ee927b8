import "server-only";
import { Op } from "sequelize";
import { db } from "@/models";
import type { Invitation, User } from "@/models";

export type PendingInvitation = { id: number; email: string; role: string; expiresAt: string; invitedBy: string };

export async function listPendingInvitations(organizationId: number): Promise<PendingInvitation[]> {
  const { Invitation, User } = db();
  const rows = await Invitation.findAll({
    where: { organizationId, acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [{ model: User, as: "invitedBy", attributes: ["name"] }],
    order: [["createdAt", "DESC"]],
  });
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    role: r.role,
    expiresAt: r.expiresAt.toISOString(),
    invitedBy: (r as Invitation & { invitedBy?: User }).invitedBy?.name ?? "",
  }));
}
