import { AppError } from "@/lib/errors";
import { route } from "@/lib/server/auth/guard";
import { readDevMailbox } from "@/lib/server/mail/read-dev-mailbox";

export const dynamic = "force-dynamic";

// Exists only while the local fake SMTP server catches mail, and only for requests made on this machine.
export const GET = route({ resource: "dev-mailbox" }, async ({ request }) => {
  const messages = await readDevMailbox(request.headers);
  if (!messages) throw new AppError("not-found", "Not found.");
  return Response.json({ messages }, { headers: { "cache-control": "no-store" } });
});
