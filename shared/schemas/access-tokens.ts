// Personal access tokens: what a person asks for when creating one, and what the list shows (never the secret,
// which the create answer carries exactly once).
import { z } from "zod";

export const TOKEN_SCOPES = ["read", "write"] as const;
export type TokenScope = (typeof TOKEN_SCOPES)[number];
/** A token lives at most a year: a forgotten token in an old notebook should stop working on its own. */
export const TOKEN_MAX_DAYS = 366;

export const NewAccessTokenBody = z.object({
  name: z
    .string()
    .trim()
    .min(1, { message: "Name the token, e.g. after the script that uses it" })
    .max(120, { message: "A token name has at most 120 characters" }),
  scope: z.enum(TOKEN_SCOPES, { message: "Scope is read or write" }),
  expiresInDays: z
    .number()
    .int({ message: "Days are whole numbers" })
    .min(1, { message: "A token lives at least one day" })
    .max(TOKEN_MAX_DAYS, { message: `A token lives at most ${TOKEN_MAX_DAYS} days` }),
  /** Absent or null: every project the owner is in. */
  projectIds: z
    .array(z.string().uuid({ message: "A project id is a UUID" }))
    .min(1, { message: "List at least one project, or leave the list out for all projects" })
    .max(100)
    .nullish(),
});
export type NewAccessTokenBody = z.infer<typeof NewAccessTokenBody>;

export const AccessToken = z.object({
  id: z.string().uuid(),
  name: z.string(),
  scope: z.enum(TOKEN_SCOPES),
  projectIds: z.array(z.string().uuid()).nullable(),
  expiresAt: z.string(),
  lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
  createdAt: z.string(),
});
export type AccessToken = z.infer<typeof AccessToken>;

export const AccessTokenList = z.array(AccessToken);
export type AccessTokenList = z.infer<typeof AccessTokenList>;

/** The create answer: the token record plus its secret, shown this once. */
export const CreatedAccessToken = AccessToken.extend({ token: z.string() });
export type CreatedAccessToken = z.infer<typeof CreatedAccessToken>;

export const AccessTokenParams = z.object({ tokenId: z.string().uuid({ message: "A token id is a UUID" }) });
