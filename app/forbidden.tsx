import { getSessionUser } from "@/lib/server/auth/session";
import { ForbiddenView } from "@/components/workspace/forbidden-view";

/** Rendered with HTTP 403 when a page calls forbidden() (lib/server/auth/require-page-user.ts). */
export default async function Forbidden() {
  const user = await getSessionUser();
  return <ForbiddenView role={user?.role ?? null} />;
}
