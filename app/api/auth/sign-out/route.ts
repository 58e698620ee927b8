import { route } from "@/lib/server/auth/guard";
import { signOutResponse } from "@/lib/server/auth/sign-out";

export const dynamic = "force-dynamic";

/**
 * The Sign out button's form posts here (a plain HTML form: it works before the page's scripts
 * have loaded). Ends this session on the server, clears the cookie and sends the browser home.
 */
export const POST = route({ resource: "account" }, async ({ request }) => signOutResponse(request));
