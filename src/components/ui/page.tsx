import type { ReactNode } from "react";

export function PageHeader({ title, lead, actions }: { title: string; lead?: ReactNode; actions?: ReactNode }) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div>
        <h1 className="text-2xl font-bold text-ink-900">{title}</h1>
        {lead && <p className="mt-1 max-w-2xl text-ink-500">{lead}</p>}
      </div>
      {actions}
    </header>
  );
}

export function Card({ title, children, className = "" }: { title?: string; children: ReactNode; className?: string }) {
  return (
    <section className={`rounded-card border border-line bg-card p-gutter ${className}`}>
      {title && <h2 className="mb-4 text-lg font-semibold text-ink-900">{title}</h2>}
      {children}
    </section>
  );
}

/** Centred single card for the signed-out pages. */
export function AuthLayout({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center px-4 py-10">
      <div className="w-full max-w-md">
        <p className="mb-6 text-center text-xl font-bold tracking-tight text-must-700">Cellarpact</p>
        <div className="rounded-card border border-line bg-card p-8 shadow-sm">
          <h1 className="mb-6 text-xl font-bold text-ink-900">{title}</h1>
          {children}
        </div>
      </div>
    </main>
  );
}
