/** Request schemas shared by the sign-in, invitation and member forms and the API that checks them. */
import { z } from "zod";
import { ORGANISATION_KINDS, ROLES } from "./roles.ts";

export const PASSWORD_MIN = 10;
// bcrypt only reads the first 72 bytes; longer passwords would silently lose their tail.
export const PASSWORD_MAX_BYTES = 72;

export const emailSchema = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .max(254, { error: "An e-mail address has at most 254 characters." })
  .pipe(z.email({ error: "Enter a valid e-mail address." }));

export const newPasswordSchema = z
  .string({ error: "Enter a password." })
  .min(PASSWORD_MIN, { error: `Use at least ${PASSWORD_MIN} characters.` })
  .refine((p) => new TextEncoder().encode(p).length <= PASSWORD_MAX_BYTES, {
    error: `Use at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters).`,
  })
  // Control characters cannot be typed the same way twice on every device (OWASP ASVS 5.0 V6.2).
  .refine((p) => !/\p{Cc}/u.test(p), { error: "A password cannot contain control characters (tabs, line breaks and the like)." });

export const personNameSchema = z
  .string({ error: "Enter a name." })
  .trim()
  .min(1, { error: "Enter a name." })
  .max(120, { error: "A name has at most 120 characters." })
  .refine((s) => !/[<>]/.test(s), { error: "A name cannot contain < or >." })
  // Names go into mails; a web address or a control character there would read as Cellarpact's own words.
  .refine((s) => !/\p{Cc}/u.test(s), { error: "A name cannot contain control characters (tabs, line breaks and the like)." })
  .refine((s) => !/(?:[a-z][a-z0-9+.-]*:\/\/|www\.|\b[a-z0-9-]+\.(?:com|net|org|io|info|biz|xyz|top|ru|cn)\b)/i.test(s), {
    error: "A name cannot contain a web address.",
  });

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: "Enter your password." }).min(1, { error: "Enter your password." }).max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const passwordResetRequestSchema = z.object({ email: emailSchema });
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestSchema>;

export const tokenSchema = z
  .string({ error: "The link is incomplete." })
  .regex(/^[A-Za-z0-9_-]{32,128}$/, { error: "The link is not valid." });

export const passwordResetSchema = z.object({ token: tokenSchema, password: newPasswordSchema });
export type PasswordResetInput = z.infer<typeof passwordResetSchema>;

export const inviteSchema = z.object({
  email: emailSchema,
  role: z.enum(ROLES, { error: "Choose a role." }),
});
export type InviteInput = z.infer<typeof inviteSchema>;

export const acceptInvitationSchema = z.object({
  token: tokenSchema,
  name: personNameSchema,
  password: newPasswordSchema,
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

export const changeRoleSchema = z.object({ role: z.enum(ROLES, { error: "Choose a role." }) });
export type ChangeRoleInput = z.infer<typeof changeRoleSchema>;

export const profileSchema = z.object({ name: personNameSchema });
export type ProfileInput = z.infer<typeof profileSchema>;

export const changePasswordSchema = z.object({
  currentPassword: z.string({ error: "Enter your current password." }).min(1, { error: "Enter your current password." }),
  newPassword: newPasswordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

export const organisationNameSchema = z
  .string({ error: "Enter a name." })
  .trim()
  .min(2, { error: "Use at least 2 characters." })
  .max(160, { error: "A name has at most 160 characters." })
  .refine((s) => !/[<>]/.test(s), { error: "A name cannot contain < or >." })
  // Names go into mails; a web address or a control character there would read as Cellarpact's own words.
  .refine((s) => !/\p{Cc}/u.test(s), { error: "A name cannot contain control characters (tabs, line breaks and the like)." })
  .refine((s) => !/(?:[a-z][a-z0-9+.-]*:\/\/|www\.|\b[a-z0-9-]+\.(?:com|net|org|io|info|biz|xyz|top|ru|cn)\b)/i.test(s), {
    error: "A name cannot contain a web address.",
  });

export const createOrganisationSchema = z.object({
  name: organisationNameSchema,
  kind: z.enum(ORGANISATION_KINDS, { error: "Choose the kind of organisation." }),
  country: z
    .string({ error: "Enter a two-letter country code." })
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{2}$/, { error: "Use a two-letter country code such as FR." }),
  adminEmail: emailSchema,
});
export type CreateOrganisationInput = z.infer<typeof createOrganisationSchema>;

/** A new password typed twice, as the reset and invitation forms ask: spread into a form's object, then `.refine(...passwordsMatch)`. */
export const repeatedPassword = { password: newPasswordSchema, confirm: z.string() };
export const passwordsMatch: [(v: { password: string; confirm: string }) => boolean, { path: string[]; error: string }] = [
  (v) => v.password === v.confirm,
  { path: ["confirm"], error: "The two passwords differ." },
];
