import { QueryClientProvider } from "@tanstack/react-query";
import { useState } from "react";
import { RouterProvider } from "react-router";
import { authKeys } from "../features/auth/api/auth-keys";
import { createQueryClient } from "../lib/query-client";
import { createAppRouter } from "./router";

export function AppProviders() {
  const [queryClient] = useState(() => {
    const client = createQueryClient({
      onSessionDoubt: () => void client.invalidateQueries({ queryKey: authKeys.session() }),
    });
    return client;
  });
  const [router] = useState(() => createAppRouter());
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
