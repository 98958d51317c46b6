import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { api } from "../../lib/api-client.ts";
import { EmptyState, QueryStatus } from "../../components/ui/states.tsx";

interface InboxMessage {
  id: string;
  receivedAt: string;
  to: string[];
  subject: string;
  text: string;
}

/** Turns the links in a plain-text mail into clickable links. */
function Linked({ text }: { text: string }) {
  return (
    <>
      {text.split(/(https?:\/\/\S+)/g).map((part, i) =>
        /^https?:\/\//.test(part) ? (
          <a key={i} href={part} className="break-all font-semibold text-must-700 underline">
            {part}
          </a>
        ) : (
          <span key={i}>{part}</span>
        ),
      )}
    </>
  );
}

export function DevInboxPage() {
  const inbox = useQuery({ queryKey: ["dev-inbox"], queryFn: () => api<InboxMessage[]>("/api/dev/inbox"), refetchInterval: 3000 });
  return (
    <main className="mx-auto max-w-4xl px-gutter py-8">
      <h1 className="text-2xl font-bold">Development inbox</h1>
      <p className="mt-1 text-ink-500">
        Mail that Cellarpact sent to the local mail fake, newest first. Nothing here left this machine.{" "}
        <Link to="/" className="font-semibold text-must-700 underline">
          Back to Cellarpact
        </Link>
      </p>
      <div className="mt-6 flex flex-col gap-4">
        <QueryStatus query={inbox} />
        {inbox.data?.length === 0 && (
          <EmptyState title="No mail yet.">Invite someone or ask for a password reset, and the mail appears here.</EmptyState>
        )}
        {inbox.data?.map((m) => (
          <article key={m.id} className="rounded-card border border-line bg-card p-gutter">
            <h2 className="text-lg font-semibold">{m.subject}</h2>
            <p className="text-sm text-ink-500">
              To {m.to.join(", ")} · {new Date(m.receivedAt).toLocaleString("en-GB")}
            </p>
            <pre className="mt-3 whitespace-pre-wrap font-sans text-sm text-ink-900">
              <Linked text={m.text} />
            </pre>
          </article>
        ))}
      </div>
    </main>
  );
}
