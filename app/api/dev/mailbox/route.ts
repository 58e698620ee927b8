import { AppError } from "@/lib/errors";
import { route } from "@/lib/server/auth/guard";
import { readDevMailbox } from "@/lib/server/mail/read-dev-mailbox";

export const dynamic = "force-dynamic";

// Exists only while the local fake SMTP server runs (development and tests).
export const GET = route({ access: "public" }, async () => {
  const messages = await readDevMailbox();
  if (!messages) throw new AppError("not-found", "Not found.");
  return { messages };
});
