import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { outboxMessage } from "#core/contracts/outbox";
import { api } from "../../../lib/api-client";
import { outboxKeys } from "./outbox-keys";

const outboxResponse = z.object({ messages: z.array(outboxMessage) });

export async function getOutbox(signal?: AbortSignal) {
  const { messages } = await api.get("/api/outbox", outboxResponse, signal);
  return messages;
}

export function outboxQueryOptions() {
  return queryOptions({
    queryKey: outboxKeys.list(),
    queryFn: ({ signal }) => getOutbox(signal),
    // Mail arrives from other actions (an invitation sent a moment ago): always look again.
    staleTime: 0,
    refetchOnWindowFocus: true,
    // Mail goes out through a queue a moment after the action: keep looking while the screen is open.
    refetchInterval: 3_000,
  });
}

export function useOutbox(options: { enabled?: boolean } = {}) {
  return useQuery({ ...outboxQueryOptions(), enabled: options.enabled ?? true });
}
