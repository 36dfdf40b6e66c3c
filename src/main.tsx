import { config as zodConfig } from "zod/v4/core";
import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import { QueryClientProvider } from "@tanstack/react-query";
import { RouterProvider } from "react-router";
import { createQueryClient } from "./lib/query-client.ts";
import { router } from "./app/router.tsx";
import "./styles.css";

// Our CSP forbids eval; without this, zod probes `new Function` once per page and the browser logs the refusal.
zodConfig({ jitless: true });

const queryClient = createQueryClient();

createRoot(document.getElementById("root")!).render(
  <StrictMode>
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  </StrictMode>,
);
