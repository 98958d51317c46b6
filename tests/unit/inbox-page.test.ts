/**
 * The mail fake's inbox page escapes everything a mail carries (OWASP XSS Prevention Cheat Sheet,
 * rule 1: HTML-encode before inserting untrusted data into element content) and links only http(s) addresses.
 */
import { describe, expect, it } from "vitest";
import { inboxPage } from "../../server/fakes/inbox-page.ts";

const mail = (text: string, subject = "Reset your password") => ({
  id: "1",
  receivedAt: "2026-12-04T03:00:00.000Z",
  from: "no-reply@cellarpact.test",
  to: ["owen.pryce@harbourline.test"],
  subject,
  text,
  messageId: null,
});

describe("the inbox page", () => {
  it("when a mail carries markup, then it is shown as text and only its web address becomes a link", () => {
    const html = inboxPage([mail('Hi <script>alert(1)</script> "x" open https://app.test/reset?t=a&b=c now', "<b>Hi</b>")]);
    expect(html).not.toContain("<script>alert");
    expect(html).toContain("&lt;script&gt;alert(1)&lt;/script&gt; &quot;x&quot;");
    expect(html).toContain("<h2>&lt;b&gt;Hi&lt;/b&gt;</h2>");
    expect(html).toContain('<a href="https://app.test/reset?t=a&amp;b=c">https://app.test/reset?t=a&amp;b=c</a>');
  });

  it("when nothing has arrived, then the page says so", () => {
    expect(inboxPage([])).toContain("No mail yet.");
  });
});
