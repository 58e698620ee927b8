import bcrypt from "bcryptjs";
import { randomBytes } from "node:crypto";
import { db } from "@/models";
import type { Organization, User, Device } from "@/models";
import type { UserRole } from "@/models/user";
import { TestClient } from "./client";
import { assertLoopbackDatabase } from "./loopback";

import { factoryPassword } from "./factory-password";

export { factoryPassword };
const passwordHash = bcrypt.hashSync(factoryPassword, 4);

export const uniqueEmail = (label: string) => `${label}-${randomBytes(5).toString("hex")}@factory.example`;

type Made = { organization: Organization; users: Record<UserRole, User> };

/** An organization of its own with one user per role (random e-mails), for one test file. */
export async function makeOrganization(kind: "vendor" | "lab" = "vendor"): Promise<Made> {
  const { Organization, User } = db();
  assertLoopbackDatabase();
  const tag = randomBytes(4).toString("hex");
  const organization = await Organization.create({ slug: `factory-${tag}`, name: `Factory Org ${tag}`, kind });
  const users = {} as Record<UserRole, User>;
  for (const role of ["admin", "engineer", "reviewer", "customer"] as const) {
    users[role] = await User.create({ organizationId: organization.id, email: uniqueEmail(role), name: `${role} ${tag}`, role, passwordHash });
  }
  return { organization, users };
}

export async function makeDevice(organizationId: number, partNumber = `FX-${randomBytes(3).toString("hex")}`): Promise<Device> {
  const { Device } = db();
  return Device.create({
    organizationId,
    createdById: null,
    partNumber,
    deviceClass: "frequency-multiplier",
    title: "Factory doubler",
    description: "",
    keyConditions: { multiplicationFactor: 2 },
  });
}

export type Who = UserRole | "signed-out";
export const everyone: Who[] = ["signed-out", "customer", "engineer", "reviewer", "admin"];

/** One client per role of the organization, signed in (and one signed out), each with its own cookies. */
export async function clientsByRole(made: Made): Promise<Map<Who, TestClient>> {
  const clients = new Map<Who, TestClient>();
  for (const who of everyone) {
    const client = new TestClient();
    if (who !== "signed-out") {
      const signedIn = await client.signIn(made.users[who].email, factoryPassword);
      if (!signedIn.ok) throw new Error(`factory ${who} could not sign in`);
    }
    clients.set(who, client);
  }
  return clients;
}

