import { z } from "zod";
import { deviceClasses } from "@/lib/domain/device-classes";

/** Following a released part ({ organization, partNumber }) or an organization's device class ({ organization, deviceClass }). */
export const followBodySchema = z
  .object({
    organization: z.string().trim().min(1, "Name the organization.").max(100),
    partNumber: z.string().trim().min(1).max(100).optional(),
    deviceClass: z.enum(deviceClasses as [string, ...string[]], { message: "Unknown device class." }).optional(),
  })
  .strict()
  .refine((b) => (b.partNumber === undefined) !== (b.deviceClass === undefined), { message: "Follow either a part (partNumber) or a device class (deviceClass), one of the two.", path: ["partNumber"] });
export type FollowBody = z.infer<typeof followBodySchema>;

export const unsubscribeBodySchema = z.object({ token: z.string().min(1, "The link carries no token.").max(200, "That is not an unsubscribe token.") }).strict();
