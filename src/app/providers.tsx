import { QueryClientProvider } from "@tanstack/react-query";
import { useState } from "react";
import { RouterProvider } from "react-router";
import { createAppQueryClient } from "./app-query-client";
import { createAppRouter } from "./router";

export function AppProviders() {
  const [queryClient] = useState(createAppQueryClient);
  const [router] = useState(createAppRouter);
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
