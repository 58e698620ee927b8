import type { Role } from "@/lib/domain/permissions";

export const roleLabels: Record<Role, string> = {
  admin: "Administrator",
  engineer: "Engineer",
  reviewer: "Reviewer",
  customer: "Customer",
};

export const organizationKindLabels = { vendor: "Component maker", lab: "Test laboratory", customer: "Customer" } as const;
