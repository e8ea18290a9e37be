import { useMutation } from "@tanstack/react-query";
import { Profile, type ChangePasswordBody } from "@shared/schemas/accounts";
import { apiRequest } from "@/lib/api-client";

export const changePassword = (body: ChangePasswordBody) =>
  apiRequest("/users/me/password", Profile, { method: "POST", body });

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
