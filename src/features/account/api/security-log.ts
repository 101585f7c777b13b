import { queryOptions, useQuery } from "@tanstack/react-query";
import { securityLog } from "#core/contracts/security-log";
import { api } from "../../../lib/api-client";
import { accountKeys } from "./account-keys";

export function getSecurityLog(signal?: AbortSignal) {
  return api.get("/api/company/security-log", securityLog, signal);
}

export function useSecurityLog(options: { enabled: boolean }) {
  return useQuery({
    ...queryOptions({ queryKey: accountKeys.securityLog(), queryFn: ({ signal }) => getSecurityLog(signal) }),
    enabled: options.enabled,
  });
}
