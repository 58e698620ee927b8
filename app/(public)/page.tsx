import { getSessionUser } from "@/lib/server/auth/session";
import { navigationFor } from "@/lib/domain/permissions";
import { HomeView } from "@/components/home/home-view";

export default async function HomePage() {
  const user = await getSessionUser();
  const start = user ? navigationFor(user.role)[0] : null;
  return <HomeView start={start ? { href: start.href, label: start.label } : null} />;
}
