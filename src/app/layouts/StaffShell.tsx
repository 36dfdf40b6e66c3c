import { Navigate, NavLink, Outlet, useLocation, useNavigate } from "react-router";
import { useSession, useSignOut } from "../../lib/auth.ts";
import { navFor } from "../nav.ts";
import { Wordmark } from "../../components/ui/Page.tsx";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";
import { ROLE_LABELS } from "../../../shared/constants/roles.ts";

/** The staff area's frame: navigation for the signed-in role, and the sign-in redirect for everyone else. */
export default function StaffShell() {
  const session = useSession();
  const location = useLocation();
  const navigate = useNavigate();
  const signOut = useSignOut();

  if (session.isPending) return <Loading label="Checking your sign-in…" />;
  if (session.isError)
    return (
      <main className="mx-auto max-w-xl p-6">
        <Notice tone="danger" title="Forthright could not be reached">
          {session.error.message}
        </Notice>
      </main>
    );
  const user = session.data.user;
  if (!user) {
    const next = location.pathname + location.search;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }

  return (
    <div className="min-h-dvh lg:grid lg:grid-cols-[15rem_1fr]">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-10 focus:bg-paper-raised focus:p-2">
        Skip to content
      </a>
      <aside className="border-b border-line bg-paper-sunk lg:min-h-dvh lg:border-b-0 lg:border-r">
        <div className="flex items-center justify-between gap-4 px-5 py-4 lg:block">
          <NavLink to="/app" className="text-ink no-underline" aria-label="Forthright staff overview">
            <Wordmark className="text-lg" />
          </NavLink>
          <p className="text-xs text-ink-soft lg:mt-1">Staff area</p>
        </div>
        <nav aria-label="Staff" className="overflow-x-auto px-3 pb-3 lg:pb-6">
          <ul className="flex gap-1 lg:flex-col">
            {navFor(user).map((item) => (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  end={item.end}
                  className={({ isActive }) =>
                    `block whitespace-nowrap rounded-md px-3 py-2 font-bold no-underline ${isActive ? "bg-paper-raised text-ink shadow-[inset_3px_0_0_var(--color-signal)]" : "text-ink-soft hover:bg-paper-raised hover:text-ink"}`
                  }
                >
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <div className="hidden border-t border-line px-5 py-4 lg:block">
          <p className="text-sm font-bold" data-testid="signed-in-as">
            {user.name}
          </p>
          <p className="text-xs text-ink-soft">
            {user.email} · {ROLE_LABELS[user.role].label}
          </p>
        </div>
      </aside>
      <div>
        <div className="flex items-center justify-end gap-3 border-b border-line px-5 py-2 text-sm">
          <span className="text-ink-soft lg:hidden">
            {user.name} · {ROLE_LABELS[user.role].label}
          </span>
          <a href="/" className="font-bold no-underline hover:underline">
            Public site
          </a>
          <button
            type="button"
            className="min-h-11 rounded-md px-3 font-bold text-signal hover:bg-signal-wash"
            onClick={() => signOut.mutate(undefined, { onSettled: () => void navigate("/sign-in", { replace: true }) })}
          >
            Sign out
          </button>
        </div>
        <main id="main" className="mx-auto max-w-6xl px-5 py-6">
          <Outlet context={user} />
        </main>
      </div>
    </div>
  );
}
