import { queryOptions, useQuery } from "@tanstack/react-query";
import { companySettings } from "#core/contracts/company";
import { api } from "../../../lib/api-client";
import { settingsKeys } from "./settings-keys";

export function getCompanySettings(signal?: AbortSignal) {
  return api.get("/api/company/settings", companySettings, signal);
}

export function companySettingsQueryOptions() {
  return queryOptions({ queryKey: settingsKeys.company(), queryFn: ({ signal }) => getCompanySettings(signal) });
}

export function useCompanySettings() {
  return useQuery(companySettingsQueryOptions());
}
