/**
 * The mail fake's own inbox page, on its loopback port only: the app never serves anyone's mail.
 * Plain server-rendered HTML, every text escaped, links made clickable; reloaded by hand (a timed
 * refresh would move the page under a reader, WCAG 2.2.1).
 */
import type { CaughtMail } from "./mail-fake.ts";

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

/** Escapes the text, then turns each http(s) address in it into a link. */
const linked = (text: string) => escapeHtml(text).replace(/https?:\/\/[^\s<]+/g, (url) => `<a href="${url}">${url}</a>`);

export function inboxPage(messages: readonly CaughtMail[]): string {
  const items = [...messages]
    .reverse()
    .map(
      (m) => `<article>
  <h2>${escapeHtml(m.subject)}</h2>
  <p class="meta">To ${escapeHtml(m.to.join(", "))} · ${escapeHtml(new Date(m.receivedAt).toLocaleString("en-GB", { timeZone: "UTC" }))} UTC</p>
  <pre>${linked(m.text)}</pre>
</article>`,
    )
    .join("\n");
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Development inbox</title>
<style>
  body { font: 16px/1.5 system-ui, sans-serif; margin: 0 auto; max-width: 56rem; padding: 2rem 1rem; color: #1f1a17; background: #faf7f2; }
  article { background: #fff; border: 1px solid #ddd3c7; border-radius: 8px; padding: 1rem; margin-top: 1rem; }
  h2 { font-size: 1.1rem; margin: 0; }
  .meta { color: #6b625a; font-size: .875rem; margin: .25rem 0 0; }
  pre { white-space: pre-wrap; font: inherit; font-size: .9rem; }
  a { color: #7a2336; font-weight: 600; word-break: break-all; }
</style>
</head>
<body>
<h1>Development inbox</h1>
<p>Mail the demo sent to the local mail fake, newest first. Nothing here left this machine, and only this machine can open this page. <a href="/">Refresh</a></p>
${items || "<p><strong>No mail yet.</strong> Invite someone or ask for a password reset, and the mail appears here.</p>"}
</body>
</html>`;
}
