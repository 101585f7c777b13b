import { useMutation, useQueryClient } from "@tanstack/react-query";
import { sessionInfo, switchCompanyInput, type SessionInfo } from "#core/contracts/auth";
import { api } from "../../../lib/api-client";
import { switchSession } from "./session-cache";

export { switchCompanyInput };

export function switchCompany(companyId: string): Promise<SessionInfo> {
  return api.post("/api/auth/switch-company", sessionInfo, switchCompanyInput.parse({ companyId }));
}

export function useSwitchCompany() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: switchCompany,
    onSuccess: (info) => switchSession(queryClient, info),
  });
}
