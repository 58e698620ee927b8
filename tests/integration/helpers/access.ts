import { allows, resources, type Resource } from "@/lib/access/matrix";
import type { Who } from "./factories";

export type Verdict = "allowed" | "unauthenticated" | "forbidden";

/**
 * What the access matrix (lib/access/matrix.ts) says a caller gets from a resource: the page and
 * API access tests take their expectations from here, never from a list of their own.
 */
export function verdictFor(resource: Resource, who: Who): Verdict {
  const access = resources[resource].access;
  if (access === "public") return "allowed";
  // A bench-token resource admits no session at all: a signed-in person is as unknown to it as a visitor.
  if (access === "bench-token" || who === "signed-out") return "unauthenticated";
  return allows(who, resource) ? "allowed" : "forbidden";
}
