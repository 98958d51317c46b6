/** Reads what the local SMTP fake received, for the demo's development inbox page. */
export interface InboxMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  messageId: string | null;
}

export async function readDevInbox(inboxUrl: string): Promise<InboxMessage[]> {
  const res = await fetch(new URL("/messages", inboxUrl), { signal: AbortSignal.timeout(3000) });
  if (!res.ok) throw new Error(`the mail fake answered ${res.status}`);
  return (await res.json()) as InboxMessage[];
}
