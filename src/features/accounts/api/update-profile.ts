import { useMutation, useQueryClient } from "@tanstack/react-query";
import { Profile, type UpdateProfileBody } from "@shared/schemas/accounts";
import { apiRequest } from "@/lib/api-client";
import { accountKeys } from "./keys";

export const updateProfile = (body: UpdateProfileBody) => apiRequest("/users/me", Profile, { method: "PATCH", body });

export function useUpdateProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateProfile,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: accountKeys.profile() });
      void queryClient.invalidateQueries({ queryKey: accountKeys.session() });
    },
  });
}
