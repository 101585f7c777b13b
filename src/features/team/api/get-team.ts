import { queryOptions, useQuery } from "@tanstack/react-query";
import { teamResponse } from "#core/contracts/members";
import { api } from "../../../lib/api-client";
import { teamKeys } from "./team-keys";

export function getTeam(signal?: AbortSignal) {
  return api.get("/api/team", teamResponse, signal);
}

export function teamQueryOptions() {
  return queryOptions({ queryKey: teamKeys.list(), queryFn: ({ signal }) => getTeam(signal) });
}

export function useTeam(options: { enabled?: boolean } = {}) {
  return useQuery({ ...teamQueryOptions(), enabled: options.enabled ?? true });
}
