import { PageHeader } from "@/components/ui/page-header";
import { PeoplePanel, type InvitationRow, type PersonRow } from "./people-panel";

type PeopleViewProps = { organizationName: string; currentUserId: number; users: PersonRow[]; invitations: InvitationRow[] };

export function PeopleView({ organizationName, currentUserId, users, invitations }: PeopleViewProps) {
  return (
    <>
      <PageHeader
        runningHead={organizationName}
        title="People"
        lead="Who works in this organization and in which role. A role decides what each person sees; disabling an account ends its sessions at once."
      />
      <PeoplePanel currentUserId={currentUserId} initialUsers={users} initialInvitations={invitations} />
    </>
  );
}
