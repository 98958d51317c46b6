import { createBrowserRouter, RouterProvider } from "react-router-dom";
import { AppShell } from "./app-shell.tsx";
import { ROUTES } from "../../shared/paths.ts";
import { RouteError } from "./route-error.tsx";

// Every page is its own chunk; the shell and sign-in guard load first.
const router = createBrowserRouter([
  {
    path: "/sign-in",
    lazy: () => import("../features/auth/sign-in-page.tsx").then((m) => ({ Component: m.SignInPage })),
    errorElement: <RouteError />,
  },
  {
    path: "/forgot-password",
    lazy: () => import("../features/auth/forgot-password-page.tsx").then((m) => ({ Component: m.ForgotPasswordPage })),
  },
  {
    path: "/reset-password/:token",
    lazy: () => import("../features/auth/reset-password-page.tsx").then((m) => ({ Component: m.ResetPasswordPage })),
  },
  {
    path: "/accept-invitation/:token",
    lazy: () => import("../features/auth/accept-invitation-page.tsx").then((m) => ({ Component: m.AcceptInvitationPage })),
  },
  {
    path: "/",
    element: <AppShell />,
    errorElement: <RouteError />,
    children: [
      { index: true, lazy: () => import("../features/home/home-page.tsx").then((m) => ({ Component: m.HomePage })) },
      { path: "members", lazy: () => import("../features/members/members-page.tsx").then((m) => ({ Component: m.MembersPage })) },
      { path: "activity", lazy: () => import("../features/trail/activity-page.tsx").then((m) => ({ Component: m.ActivityPage })) },
      { path: "specs", lazy: () => import("../features/specs/specs-list-page.tsx").then((m) => ({ Component: m.SpecsListPage })) },
      { path: ROUTES.spec.slice(1), lazy: () => import("../features/specs/spec-page.tsx").then((m) => ({ Component: m.SpecPage })) },
      {
        path: "specs/:specId/compare",
        lazy: () => import("../features/specs/compare-page.tsx").then((m) => ({ Component: m.ComparePage })),
      },
      {
        path: ROUTES.contract.slice(1),
        lazy: () => import("../features/specs/contract-page.tsx").then((m) => ({ Component: m.ContractPage })),
      },
      { path: "lots", lazy: () => import("../features/lots/lots-page.tsx").then((m) => ({ Component: m.LotsPage })) },
      { path: ROUTES.lot.slice(1), lazy: () => import("../features/lots/lot-page.tsx").then((m) => ({ Component: m.LotPage })) },
      { path: "readiness", lazy: () => import("../features/lots/readiness-page.tsx").then((m) => ({ Component: m.ReadinessPage })) },
      {
        path: "contracts/:contractId/import",
        lazy: () => import("../features/lots/import-page.tsx").then((m) => ({ Component: m.ImportPage })),
      },
      {
        path: "contracts/:contractId/trends",
        lazy: () => import("../features/lots/trends-page.tsx").then((m) => ({ Component: m.TrendsPage })),
      },
      {
        path: "deviations",
        lazy: () => import("../features/deviations/deviations-page.tsx").then((m) => ({ Component: m.DeviationsPage })),
      },
      {
        path: ROUTES.deviation.slice(1),
        lazy: () => import("../features/deviations/deviation-page.tsx").then((m) => ({ Component: m.DeviationPage })),
      },
      { path: "audits", lazy: () => import("../features/audits/audits-page.tsx").then((m) => ({ Component: m.AuditsPage })) },
      { path: ROUTES.order.slice(1), lazy: () => import("../features/audits/order-page.tsx").then((m) => ({ Component: m.OrderPage })) },
      { path: "price-list", lazy: () => import("../features/audits/price-list-page.tsx").then((m) => ({ Component: m.PriceListPage })) },
      {
        path: "notifications",
        lazy: () => import("../features/notifications/notifications-page.tsx").then((m) => ({ Component: m.NotificationsPage })),
      },
      { path: "profile", lazy: () => import("../features/profile/profile-page.tsx").then((m) => ({ Component: m.ProfilePage })) },
      {
        path: "platform/organisations",
        lazy: () => import("../features/platform/organisations-page.tsx").then((m) => ({ Component: m.OrganisationsPage })),
      },
      { path: "*", element: <RouteError notFound /> },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
