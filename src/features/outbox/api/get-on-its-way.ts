import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { outgoingMessage } from "#core/contracts/outbox";
import { api } from "../../../lib/api-client";
import { outboxKeys } from "./outbox-keys";

const onItsWayResponse = z.object({ messages: z.array(outgoingMessage) });

/** The company's mail not yet delivered, looked at again every few seconds while the Outbox is open. */
export function useOnItsWay(options: { enabled?: boolean } = {}) {
  return useQuery({
    ...queryOptions({
      queryKey: outboxKeys.onItsWay(),
      queryFn: async ({ signal }) => (await api.get("/api/outbox/on-its-way", onItsWayResponse, signal)).messages,
      staleTime: 0,
      refetchInterval: 3_000,
    }),
    enabled: options.enabled ?? true,
  });
}
