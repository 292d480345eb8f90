import React, { useState } from "react";
import { QueryClientProvider, type QueryClient } from "@tanstack/react-query";
import { createQueryClient } from "./api/queryClient";
import { AuthProvider } from "./auth/AuthProvider";

/** React Query, then the session (sign-out needs the query cache to clear it). */
export function AppProviders({ children, queryClient }: { children: React.ReactNode; queryClient?: QueryClient }) {
  const [client] = useState(() => queryClient ?? createQueryClient());
  return (
    <QueryClientProvider client={client}>
      <AuthProvider>{children}</AuthProvider>
    </QueryClientProvider>
  );
}
