import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { expectAccessible, openMail, screenshot, signInThroughForm, signOut, startStack, type Stack } from "../support/stack.ts";
import { DEMO, uniqueEmail } from "../support/api.ts";

let s: Stack;
beforeAll(async () => {
  s = await startStack();
});
afterAll(() => s?.stop());

/** Opens the mail fake's inbox page and follows the link in the newest mail with this subject. */
async function followMailLink(subject: string, linkPath: string) {
  const { page } = s;
  const mail = await openMail(page, s.inboxUrl, subject);
  await expectAccessible(page, "dev inbox");
  await screenshot(page, `inbox-${linkPath.replace(/\W/g, "")}`);
  await mail.getByRole("link", { name: new RegExp(linkPath) }).click();
}

describe("an admin invites a colleague by e-mail", () => {
  it("when the invitee follows the mailed link and sets a password, then they are signed in with the invited role", async () => {
    const { page, baseUrl } = s;
    const email = uniqueEmail("blender");
    await signInThroughForm(page, baseUrl, DEMO.producerAdmin);
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Members" }).click();
    await page.getByLabel("E-mail address").fill(email);
    await page.getByLabel("Role", { exact: true }).selectOption("producer_quality");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText(`Invitation sent to ${email}.`).waitFor();
    await page.getByText(email).last().waitFor();
    await screenshot(page, "members-after-invite");
    await signOut(page);

    await followMailLink("You are invited to Domaine des Trois Sentes on Cellarpact", "/accept-invitation/");
    await page.getByRole("heading", { name: "Join Cellarpact" }).waitFor();
    await page.getByText("Domaine des Trois Sentes").waitFor();
    await expectAccessible(page, "accept invitation");
    await page.getByLabel("Your name").fill("Inès Fauvel");
    await page.getByLabel("Choose a password").fill("Vendanges-2027");
    await page.getByLabel("Repeat the password").fill("Vendanges-2026");
    await page.getByRole("button", { name: "Accept and sign in" }).click();
    await page.getByText("The two passwords differ.").waitFor();
    await page.getByLabel("Repeat the password").fill("Vendanges-2027");
    await screenshot(page, "accept-invitation");
    await page.getByRole("button", { name: "Accept and sign in" }).click();
    await page.getByRole("heading", { name: "Welcome, Inès" }).waitFor();
    expect(await page.getByRole("banner").textContent()).toContain("Producer quality");
    await signOut(page);

    await signInThroughForm(page, baseUrl, email, "Vendanges-2027");
    await signOut(page);

    // A role change asks first, in the page, and Cancel changes nothing; confirming changes the role.
    await signInThroughForm(page, baseUrl, DEMO.producerAdmin);
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Members" }).click();
    const role = page.getByLabel("Role of Inès Fauvel");
    await role.selectOption("org_admin");
    const ask = page.getByRole("dialog", { name: "Make Inès Fauvel organisation admin?" });
    await ask.getByText(/signed out everywhere/).waitFor();
    await expectAccessible(page, "role change confirmation");
    await ask.getByRole("button", { name: "Cancel" }).click();
    await page.reload();
    expect(await page.getByLabel("Role of Inès Fauvel").inputValue()).toBe("producer_quality");
    await page.getByLabel("Role of Inès Fauvel").selectOption("org_admin");
    const changed = page.waitForResponse((r) => r.url().includes("/members/") && r.request().method() === "PATCH");
    await page
      .getByRole("dialog", { name: "Make Inès Fauvel organisation admin?" })
      .getByRole("button", { name: "Change the role" })
      .click();
    expect((await changed).status()).toBe(200);
    await page.reload();
    expect(await page.getByLabel("Role of Inès Fauvel").inputValue()).toBe("org_admin");
    await signOut(page);
  });
});

describe("a user who forgot the password", () => {
  it("when they follow the mailed reset link, then the new password works and the old one does not", async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByRole("link", { name: "Forgot your password?" }).click();
    // The page is a lazy chunk: until it arrives the sign-in form (with its own e-mail field) is still shown.
    await page.getByRole("heading", { name: "Reset your password" }).waitFor();
    await page.getByLabel("E-mail address").fill(DEMO.bulkProducerQuality);
    await expectAccessible(page, "forgot password");
    const answer = page.waitForResponse((r) => r.url().endsWith("/api/auth/password-reset/request"));
    await page.getByRole("button", { name: "Send the reset link" }).click();
    const res = await answer;
    expect(res.status(), await res.text()).toBe(202);
    await page.getByText("a reset link is on its way").waitFor();

    await followMailLink("Reset your Cellarpact password", "/reset-password/");
    await page.getByRole("heading", { name: "Choose a new password" }).waitFor();
    await expectAccessible(page, "reset password");
    await page.getByLabel("New password", { exact: true }).fill("short");
    await page.getByRole("button", { name: "Save the new password" }).click();
    await page.getByText("Use at least 10 characters.").waitFor();
    await page.getByLabel("New password", { exact: true }).fill("Flexitank-voyage-27");
    await page.getByLabel("Repeat the new password").fill("Flexitank-voyage-27");
    await page.getByRole("button", { name: "Save the new password" }).click();
    await page.getByText("Your password has been changed.").waitFor();

    await page.getByLabel("E-mail address").fill(DEMO.bulkProducerQuality);
    await page.getByLabel("Password").fill("Cellarpact-demo-2026");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText("The e-mail address or the password is not right.").waitFor();
    await signInThroughForm(page, baseUrl, DEMO.bulkProducerQuality, "Flexitank-voyage-27");
    // Put the demo password back through the profile page.
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Profile" }).click();
    await page.getByLabel("Current password").fill("Flexitank-voyage-27");
    await page.getByLabel("New password").fill("Cellarpact-demo-2026");
    await page.getByRole("button", { name: "Change password" }).click();
    await page.getByText("Your password has been changed.").waitFor();
    await signOut(page);
  });
});
