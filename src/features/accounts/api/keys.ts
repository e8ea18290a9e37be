// Query keys of the accounts feature, widest first.
export const accountKeys = {
  all: ["accounts"] as const,
  session: () => [...accountKeys.all, "session"] as const,
  profile: () => [...accountKeys.all, "profile"] as const,
  tokens: () => [...accountKeys.all, "tokens"] as const,
  mailbox: (to: string) => [...accountKeys.all, "mailbox", to] as const,
};
