import { createBrowserRouter, Navigate, useParams, type RouteObject } from "react-router";
import { RouteError } from "./routes/route-error.tsx";
import { Loading } from "../components/feedback/Notice.tsx";
import type { Action } from "../../shared/permissions.ts";

/**
 * Each page is its own lazy module, so the public pages never download the staff area's code. A staff page that
 * is for one action (shared/permissions.ts) names it here: other roles see RequireAction's notice instead.
 */
const page = (load: () => Promise<{ default: React.ComponentType }>, allow?: Action): Pick<RouteObject, "lazy"> => ({
  lazy: async () => {
    if (!allow) return { Component: (await load()).default };
    const [{ default: Page }, { RequireAction }] = await Promise.all([load(), import("./RequireAction.tsx")]);
    return {
      element: (
        <RequireAction action={allow}>
          <Page />
        </RequireAction>
      ),
    };
  },
});

/** Older revisions open on the condition page itself (?revision=N); this address keeps links in mails working. */
function RevisionRedirect() {
  const { slug, number } = useParams();
  return <Navigate to={`/vehicles/${slug}?revision=${number}`} replace />;
}

export const routes: RouteObject[] = [
  {
    errorElement: <RouteError />,
    hydrateFallbackElement: <Loading />,
    children: [
      { path: "/", ...page(() => import("./routes/storefront.tsx")) },
      { path: "/vehicles/:slug", ...page(() => import("./routes/public-vehicle.tsx")) },
      { path: "/vehicles/:slug/revisions/:number", Component: RevisionRedirect },
      { path: "/vehicles/:slug/card", ...page(() => import("./routes/window-card.tsx")) },
      { path: "/sign-in", ...page(() => import("./routes/sign-in.tsx")) },
      { path: "/forgot-password", ...page(() => import("./routes/forgot-password.tsx")) },
      { path: "/reset-password", ...page(() => import("./routes/reset-password.tsx")) },
      { path: "/accept-invite", ...page(() => import("./routes/accept-invite.tsx")) },
      {
        path: "/app",
        ...page(() => import("./layouts/StaffShell.tsx")),
        children: [
          { index: true, ...page(() => import("./routes/staff-overview.tsx")) },
          { path: "vehicles", ...page(() => import("./routes/vehicles.tsx")) },
          { path: "vehicles/new", ...page(() => import("./routes/vehicle-new.tsx"), "vehicle.create") },
          {
            path: "vehicles/:id",
            ...page(() => import("./layouts/VehicleLayout.tsx")),
            children: [
              { index: true, ...page(() => import("./routes/vehicle-detail.tsx")) },
              { path: "photos", ...page(() => import("./routes/vehicle-photos.tsx")) },
              { path: "walkaround", ...page(() => import("./routes/vehicle-walkaround.tsx")) },
              { path: "checks", ...page(() => import("./routes/vehicle-checks.tsx")) },
            ],
          },
          { path: "leads", ...page(() => import("./routes/leads.tsx")) },
          { path: "leads/:id", ...page(() => import("./routes/lead-detail.tsx")) },
          { path: "mail", ...page(() => import("./routes/mail-outbox.tsx"), "mail.read") },
          { path: "feeds", ...page(() => import("./routes/feeds.tsx"), "feeds.manage") },
          { path: "users", ...page(() => import("./routes/users.tsx"), "users.manage") },
          { path: "settings", ...page(() => import("./routes/settings.tsx"), "dealership.edit") },
          { path: "*", ...page(() => import("./routes/not-found.tsx")) },
        ],
      },
      { path: "*", ...page(() => import("./routes/not-found.tsx")) },
    ],
  },
];

export const router = createBrowserRouter(routes);
