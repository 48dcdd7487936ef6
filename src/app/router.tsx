import { createBrowserRouter, type RouteObject } from "react-router-dom";
import { SignInPage } from "../features/auth/components/SignInPage";
import { PublicLayout } from "./PublicLayout";
import { FullPageStatus, RootLayout } from "./RootLayout";
import { NotFound, RouteError } from "./RouteError";

/*
 * The sign-in page ships in the first bundle; every other page is its own chunk, fetched when
 * first visited, so the first paint of Rillmark stays small.
 */
const publicRoutes: RouteObject[] = [
  { path: "sign-in", Component: SignInPage },
  {
    path: "sign-up",
    lazy: async () => ({
      Component: (await import("../features/auth/components/SignUpPage")).SignUpPage,
    }),
  },
  {
    path: "confirm-email/:token",
    lazy: async () => ({
      Component: (await import("../features/auth/components/ConfirmEmailPage")).ConfirmEmailPage,
    }),
  },
  {
    path: "reset-password",
    lazy: async () => ({
      Component: (await import("../features/auth/components/ResetRequestPage")).ResetRequestPage,
    }),
  },
  {
    path: "reset-password/:token",
    lazy: async () => ({
      Component: (await import("../features/auth/components/ResetCompletePage")).ResetCompletePage,
    }),
  },
  {
    path: "invitations/:token",
    lazy: async () => ({
      Component: (await import("../features/invitations/components/InvitationPage")).InvitationPage,
    }),
  },
];

const signedInRoutes: RouteObject[] = [
  {
    index: true,
    lazy: async () => ({ Component: (await import("./HomeRedirect")).HomeRedirect }),
  },
  {
    path: "teams/:teamId/projects",
    lazy: async () => ({
      Component: (await import("../features/projects/components/ProjectsPage")).ProjectsPage,
    }),
  },
  {
    path: "teams/:teamId/members",
    lazy: async () => ({
      Component: (await import("../features/team/components/TeamPage")).TeamPage,
    }),
  },
  {
    path: "teams/:teamId/catalog",
    lazy: async () => ({
      Component: (await import("../features/catalog/components/CatalogPage")).CatalogPage,
    }),
  },
  {
    path: "projects/:projectId",
    lazy: async () => ({ Component: (await import("./ProjectLayout")).ProjectLayout }),
    children: [
      {
        index: true,
        lazy: async () => ({ Component: (await import("./ProjectOverview")).ProjectOverview }),
      },
      {
        path: "map",
        lazy: async () => ({
          Component: (await import("../features/map-desk/components/MapDeskPage")).MapDeskPage,
        }),
      },
      {
        path: "layers",
        lazy: async () => ({
          Component: (await import("../features/layers/components/LayersPage")).LayersPage,
        }),
      },
      {
        path: "rainfall",
        lazy: async () => ({
          Component: (await import("../features/rainfall/components/RainfallPage")).RainfallPage,
        }),
      },
      {
        path: "rules",
        lazy: async () => ({
          Component: (await import("../features/design-rules/components/DesignRulesPage"))
            .DesignRulesPage,
        }),
      },
    ],
  },
  {
    path: "account",
    lazy: async () => ({
      Component: (await import("../features/account/components/AccountPage")).AccountPage,
    }),
  },
  {
    path: "outbox/:messageId?",
    lazy: async () => ({
      Component: (await import("../features/outbox/components/OutboxPage")).OutboxPage,
    }),
  },
];

export const routes: RouteObject[] = [
  {
    Component: RootLayout,
    HydrateFallback: FullPageStatus,
    errorElement: <RouteError />,
    children: [
      { Component: PublicLayout, children: publicRoutes },
      {
        lazy: async () => ({ Component: (await import("./SignedInLayout")).SignedInLayout }),
        children: signedInRoutes,
      },
      { path: "*", Component: NotFound },
    ],
  },
];

export const router = createBrowserRouter(routes);
