import type { Metadata } from "next";
import { listPendingInvitations } from "@/lib/server/invitations/list-pending-invitations";
import { listOrganizationUsers } from "@/lib/server/users/list-organization-users";
import { PeopleView } from "@/components/admin/people-view";
import { ForbiddenView } from "@/components/workspace/forbidden-view";
import { requirePageUser } from "@/components/workspace/require-page-user";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  const access = await requirePageUser({ permission: "user:manage", path: "/admin/users" });
  if (!access.allowed) return <ForbiddenView role={access.user.role} pageName="the people of your organization" />;
  const { organizationId } = access.user;
  const [users, invitations] = await Promise.all([listOrganizationUsers(organizationId), listPendingInvitations(organizationId)]);
  return <PeopleView organizationName={access.user.organizationName} currentUserId={access.user.id} users={users} invitations={invitations} />;
}
