// The local mail fake's messages, for site admins.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { MailMessage } from "@shared/schemas/accounts";
import { apiRequest } from "@/lib/api-client";
import { accountKeys } from "./keys";

export const listMail = (to: string) =>
  apiRequest(`/mailbox${to ? `?to=${encodeURIComponent(to)}` : ""}`, z.array(MailMessage));

export const mailQuery = (to: string) =>
  queryOptions({ queryKey: accountKeys.mailbox(to), queryFn: () => listMail(to), refetchInterval: 5_000 });

export function useMail(to: string) {
  return useQuery(mailQuery(to));
}
