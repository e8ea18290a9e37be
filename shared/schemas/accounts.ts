// Payloads for sign-up, sign-in, the session and the profile.
import { z } from "zod";
import { SITE_ROLES } from "../types/roles";

export const NAME_MAX = 120;
export const PASSWORD_MIN = 10;
/** scrypt's cost grows with input length; a bound keeps a huge "password" from becoming a denial of service. */
export const PASSWORD_MAX = 200;

export const Email = z
  .string()
  .trim()
  .max(254, { message: "An e-mail address has at most 254 characters" })
  .pipe(z.email({ message: "Enter a valid e-mail address, like name@example.org" }))
  .transform((s) => s.toLowerCase());

export const DisplayName = z
  .string()
  .trim()
  .min(1, { message: "Enter a name" })
  .max(NAME_MAX, { message: `A name has at most ${NAME_MAX} characters` });

export const NewPassword = z
  .string()
  .min(PASSWORD_MIN, { message: `A password needs at least ${PASSWORD_MIN} characters` })
  .max(PASSWORD_MAX, { message: `A password has at most ${PASSWORD_MAX} characters` });

export const SignUpBody = z.object({ email: Email, displayName: DisplayName, password: NewPassword });
export type SignUpBody = z.infer<typeof SignUpBody>;

/** Sign-up answers alike for every address, so it never tells whether one has an account. */
export const SignUpAccepted = z.object({ email: z.string() });
export type SignUpAccepted = z.infer<typeof SignUpAccepted>;

export const ConfirmSignUpBody = z.object({ token: z.string().min(20).max(200) });
export type ConfirmSignUpBody = z.infer<typeof ConfirmSignUpBody>;

export const SignInBody = z.object({
  email: Email,
  password: z
    .string()
    .min(1, { message: "Enter your password" })
    .max(PASSWORD_MAX, { message: "Wrong e-mail address or password" }),
});
export type SignInBody = z.infer<typeof SignInBody>;

export const SessionUser = z.object({
  id: z.string().uuid(),
  email: z.string(),
  displayName: z.string(),
  siteRole: z.enum(SITE_ROLES),
});
export type SessionUser = z.infer<typeof SessionUser>;

export const Session = z.object({ user: SessionUser.nullable(), mailboxAvailable: z.boolean() });
export type Session = z.infer<typeof Session>;

export const Profile = SessionUser.extend({ createdAt: z.string() });
export type Profile = z.infer<typeof Profile>;

export const UpdateProfileBody = z.object({ displayName: DisplayName });
export type UpdateProfileBody = z.infer<typeof UpdateProfileBody>;

export const ChangePasswordBody = z.object({
  currentPassword: z.string().min(1).max(PASSWORD_MAX),
  newPassword: NewPassword,
});
export type ChangePasswordBody = z.infer<typeof ChangePasswordBody>;

export const MailMessage = z.object({
  id: z.string().uuid(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  textBody: z.string(),
  receivedAt: z.string(),
});
export type MailMessage = z.infer<typeof MailMessage>;

export const MailboxQuery = z.object({ to: z.string().max(254).optional() });
