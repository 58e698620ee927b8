import type { Metadata } from "next";
import { listPendingInvitations } from "@/lib/server/invitations/list-pending-invitations";
import { listOrganizationUsers } from "@/lib/server/users/list-organization-users";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { PeopleView } from "@/components/admin/people-view";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  const user = await requirePageUser({ resource: "people", path: "/admin/users" });
  const { organizationId } = user;
  const [users, invitations] = await Promise.all([listOrganizationUsers(organizationId), listPendingInvitations(organizationId)]);
  return <PeopleView organizationName={user.organizationName} currentUserId={user.id} users={users} invitations={invitations} />;
}
