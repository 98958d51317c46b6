import { NavLink, Navigate, Outlet, useLocation, useNavigate } from "react-router-dom";
import { useSignOut } from "../features/auth/api/session.ts";
import { useSession } from "../lib/session.ts";
import { useCurrentMembership } from "../lib/current-organisation.ts";
import { SignedInProvider } from "../lib/signed-in.tsx";
import { visibleNav } from "./navigation.ts";
import { LoadingState, ErrorState } from "../components/ui/states.tsx";
import { ROLE_LABELS } from "../../shared/auth/roles.ts";
import { NotificationBell } from "../features/notifications/notification-bell.tsx";

/** Layout of every signed-in page: header with organisation switcher, role-aware navigation, content. */
export function AppShell() {
  const session = useSession();
  const location = useLocation();
  const navigate = useNavigate();
  const signOut = useSignOut();
  const { membership, choose } = useCurrentMembership(session.data?.user);

  if (session.isPending) return <LoadingState label="Opening Cellarpact…" />;
  if (session.isError) return <ErrorState error={session.error} onRetry={() => session.refetch()} />;
  const user = session.data.user;
  if (!user) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname)}`} replace />;

  const nav = visibleNav(user, membership);
  return (
    <div className="min-h-screen">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-card focus:p-2">
        Skip to content
      </a>
      <header className="border-b border-must-800 bg-must-700 text-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-gutter py-3">
          <span className="text-lg font-bold tracking-tight">Cellarpact</span>
          {user.memberships.length > 1 ? (
            <label className="flex items-center gap-2 text-sm">
              <span className="sr-only">Organisation</span>
              <select
                className="rounded bg-must-800 px-2 py-1 text-white"
                value={membership?.organisationId}
                onChange={(e) => choose(Number(e.target.value))}
              >
                {user.memberships.map((m) => (
                  <option key={m.organisationId} value={m.organisationId}>
                    {m.organisationName}
                  </option>
                ))}
              </select>
            </label>
          ) : (
            membership && <span className="text-sm text-must-100">{membership.organisationName}</span>
          )}
          <span className="ml-auto text-sm text-must-100">
            {user.name}
            {membership && ` · ${ROLE_LABELS[membership.role]}`}
            {user.isPlatformAdmin && " · Platform admin"}
          </span>
          <NotificationBell />
          <button
            type="button"
            className="rounded border border-white/40 px-3 py-1 text-sm font-semibold hover:bg-must-800"
            onClick={() => signOut.mutate(undefined, { onSettled: () => navigate("/sign-in") })}
          >
            Sign out
          </button>
        </div>
        <nav aria-label="Main" className="mx-auto max-w-6xl px-gutter">
          <ul className="flex flex-wrap gap-1">
            {nav.map((item) => (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  end={item.to === "/"}
                  className={({ isActive }) =>
                    `inline-block rounded-t-md px-4 py-2 text-sm font-semibold ${isActive ? "bg-paper text-must-700" : "text-white hover:bg-must-800"}`
                  }
                >
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      </header>
      <main id="main" className="mx-auto max-w-6xl px-gutter py-8">
        <SignedInProvider value={{ user, membership }}>
          <Outlet />
        </SignedInProvider>
      </main>
    </div>
  );
}
