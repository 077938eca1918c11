import { z } from "zod";
import { ACCOUNT_EVENT_KINDS } from "../account-events";
import { ROLES, type Role } from "../roles";

export const ACCOUNT_STATUSES = ["invited", "active", "deactivated"] as const;
export type AccountStatus = (typeof ACCOUNT_STATUSES)[number];
export const LICENCE_FILTERS = ["valid", "expiring", "expired", "none"] as const;
export type LicenceFilter = (typeof LICENCE_FILTERS)[number];

const email = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: "Enter a valid e-mail address, like name@example.com." }).max(254, { error: "Use at most 254 characters." }));

const name = z
  .string({ error: "Enter the person's name." })
  .trim()
  .min(1, { error: "Enter the person's name." })
  .max(120, { error: "Use at most 120 characters." });

const role = z.enum(ROLES, { error: `Choose a role: ${ROLES.join(", ")}.` });

const licenceNumber = z
  .string()
  .trim()
  .max(64, { error: "Use at most 64 characters." })
  .regex(/^[A-Za-z0-9][A-Za-z0-9 ./-]*$/, { error: "Use letters, digits, spaces, dots, slashes and hyphens." })
  .or(z.literal("").transform(() => null))
  .nullable();

const licenceExpiresOn = z
  .iso.date({ error: "Enter the expiry date as YYYY-MM-DD." })
  .refine((value) => value >= "2000-01-01" && value <= "2100-12-31", { error: "Enter an expiry date between 2000 and 2100." })
  .or(z.literal("").transform(() => null))
  .nullable();

const stationCode = z
  .string()
  .trim()
  .toUpperCase()
  .max(8, { error: "Use a station code of at most 8 characters." })
  .or(z.literal("").transform(() => null))
  .nullable();

export const InviteUserSchema = z
  .object({
    name,
    email,
    role,
    licenceNumber: licenceNumber.optional(),
    licenceExpiresOn: licenceExpiresOn.optional(),
    stationCode: stationCode.optional(),
  })
  .strict();
export type InviteUserInput = z.infer<typeof InviteUserSchema>;

export const UpdateUserSchema = z
  .object({
    name: name.optional(),
    role: role.optional(),
    status: z.enum(["active", "deactivated"], { error: "Status is active or deactivated." }).optional(),
    licenceNumber: licenceNumber.optional(),
    licenceExpiresOn: licenceExpiresOn.optional(),
    stationCode: stationCode.optional(),
  })
  .strict()
  .refine((value) => Object.keys(value).length > 0, { error: "Send at least one field to change." });
export type UpdateUserInput = z.infer<typeof UpdateUserSchema>;

const blankToUndefined = (value: unknown) => (value === "" ? undefined : value);

export const UserListQuerySchema = z.object({
  role: z.preprocess(blankToUndefined, role.optional()),
  status: z.preprocess(blankToUndefined, z.enum(ACCOUNT_STATUSES, { error: "Status is invited, active or deactivated." }).optional()),
  station: z.preprocess(blankToUndefined, z.string().trim().toUpperCase().max(8).optional()),
  licence: z.preprocess(blankToUndefined, z.enum(LICENCE_FILTERS, { error: "Licence is valid, expiring, expired or none." }).optional()),
  q: z.preprocess(blankToUndefined, z.string().trim().max(120).optional()),
});
export type UserListQuery = z.infer<typeof UserListQuerySchema>;

export const AccountEventQuerySchema = z.object({
  kind: z.preprocess(blankToUndefined, z.enum(ACCOUNT_EVENT_KINDS, { error: "Not a kind of account event." }).optional()),
  user: z.preprocess(blankToUndefined, z.string().trim().max(40).optional()),
  q: z.preprocess(blankToUndefined, z.string().trim().max(254).optional()),
  from: z.preprocess(blankToUndefined, z.iso.date({ error: "Enter the first day as YYYY-MM-DD." }).optional()),
  to: z.preprocess(blankToUndefined, z.iso.date({ error: "Enter the last day as YYYY-MM-DD." }).optional()),
  before: z.preprocess(blankToUndefined, z.coerce.number().int().positive().optional()),
  limit: z.preprocess(blankToUndefined, z.coerce.number().int().min(1).max(200).default(50)),
});
export type AccountEventQuery = z.infer<typeof AccountEventQuerySchema>;

export const PasswordResetRequestSchema = z.object({ email }).strict();

export const SetPasswordSchema = z
  .object({ password: z.string({ error: "Choose a password." }).min(1, { error: "Choose a password." }).max(1024) })
  .strict();

export interface StationView {
  code: string;
  name: string;
  timeZone: string;
}

export interface UserView {
  id: string;
  name: string;
  email: string;
  role: Role;
  status: AccountStatus;
  licenceNumber: string | null;
  licenceExpiresOn: string | null;
  licenceStatus: LicenceFilter;
  licenceDaysLeft: number | null;
  station: StationView | null;
  lastSignInAt: string | null;
  createdAt: string;
  invitation: { sentAt: string; expiresAt: string; expired: boolean } | null;
}

/** What the set-password forms (invitation, reset) show after a submit. */
export interface SetPasswordState {
  message?: string;
  errors?: Partial<Record<"password" | "confirm", string>>;
}
