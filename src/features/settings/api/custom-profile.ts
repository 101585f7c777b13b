import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { customProfileView, ruleProfileSchema, type CustomProfileView } from "#core/contracts/rule-profile";
import { api } from "../../../lib/api-client";
import { settingsKeys } from "./settings-keys";

export { ruleProfileSchema };
const key = () => [...settingsKeys.details(), "custom-profile"] as const;

export function useCustomProfile() {
  return useQuery({
    queryKey: key(),
    queryFn: ({ signal }) => api.get("/api/company/custom-profile", customProfileView, signal),
  });
}

/** Saving changes every figure computed from the profile, so everything is fetched again. */
function useSaved() {
  const queryClient = useQueryClient();
  return (saved: CustomProfileView) => {
    queryClient.setQueryData(key(), saved);
    void queryClient.invalidateQueries();
  };
}

export function useStartCustomProfile() {
  const onSuccess = useSaved();
  return useMutation({
    mutationFn: (from: "us-federal" | "eu-fgas") =>
      api.post("/api/company/custom-profile/start", customProfileView, { from }),
    onSuccess,
  });
}

export function useSaveCustomProfile() {
  const onSuccess = useSaved();
  return useMutation({
    mutationFn: (profile: unknown) => api.put("/api/company/custom-profile", customProfileView, profile),
    onSuccess,
  });
}
