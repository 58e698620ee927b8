import { assertLoopbackDatabase, baseUrl } from "./helpers/loopback";

export default async function setup() {
  assertLoopbackDatabase();
  const response = await fetch(`${baseUrl}/api/auth/csrf`).catch(() => null);
  if (!response?.ok) throw new Error(`the app is not answering at ${baseUrl}; run the tests through npm test`);
}
