import { useMutation, useQueryClient } from "@tanstack/react-query";
import { companySettings, type CompanySettings } from "#core/contracts/company";
import { api } from "../../../lib/api-client";
import { settingsKeys } from "./settings-keys";

export { companySettings };

export function updateCompanySettings(input: CompanySettings) {
  return api.put("/api/company/settings", companySettings, input);
}

export function useUpdateCompanySettings(options: { onSaved?: (saved: CompanySettings) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateCompanySettings,
    onSuccess: (saved) => {
      queryClient.setQueryData(settingsKeys.company(), saved);
      void queryClient.invalidateQueries({ queryKey: settingsKeys.all });
      options.onSaved?.(saved);
    },
  });
}
