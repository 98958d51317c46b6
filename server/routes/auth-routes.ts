import { z } from "zod";
import type { RouteRegistry } from "../http/route-registry.ts";
import { PUBLIC, SIGNED_IN } from "../http/access.ts";
import { endSession, startSession, type CookieSettings } from "../http/session.ts";
import { knownDevice, rememberDevice } from "../http/known-device.ts";
import {
  acceptInvitationSchema,
  changePasswordSchema,
  passwordResetRequestSchema,
  passwordResetSchema,
  profileSchema,
  signInSchema,
  tokenSchema,
} from "../../shared/auth/schemas.ts";
import * as auth from "../services/auth-service.ts";
import * as invitations from "../services/invitation-service.ts";
import { csrfTokenFor } from "../services/session-service.ts";

export function registerAuthRoutes(r: RouteRegistry, cookies: CookieSettings): void {
  const authRoutes = r.section("auth");
  const profileRoutes = r.section("profile");
  authRoutes.post(
    "/api/auth/sign-in",
    {
      summary: "Sign in with e-mail and password",
      access: PUBLIC,
      body: signInSchema,
      errors: { 401: "wrong e-mail or password (same message for both)", 429: "too many failed attempts" },
    },
    async ({ body, req, res }) => {
      const device = knownDevice(req, cookies.secret, body.email);
      const { user, sessionVersion } = await auth.signIn(body.email, body.password, device);
      rememberDevice(res, cookies, body.email, device);
      const csrfToken = startSession(res, cookies, user.id, sessionVersion);
      return { user, csrfToken };
    },
  );

  authRoutes.post("/api/auth/sign-out", { summary: "Sign out everywhere", access: SIGNED_IN }, async ({ user, res }) => {
    await auth.signOut(user.id);
    endSession(res, cookies);
  });

  authRoutes.get("/api/auth/session", { summary: "The current user, or null", access: PUBLIC }, ({ req }) => ({
    user: req.user ?? null,
    csrfToken: req.user && req.sessionId ? csrfTokenFor(cookies.secret, req.sessionId) : null,
  }));

  authRoutes.post(
    "/api/auth/password-reset/request",
    { summary: "Mail a one-time password reset link", access: PUBLIC, body: passwordResetRequestSchema, status: 202 },
    async ({ body }) => {
      await auth.requestPasswordReset(body.email);
      return { message: "If an account uses this address, a reset link is on its way." };
    },
  );

  authRoutes.post(
    "/api/auth/password-reset",
    {
      summary: "Set a new password with a reset link",
      access: PUBLIC,
      body: passwordResetSchema,
      errors: { 410: "the link expired or was used" },
    },
    async ({ body }) => {
      await auth.resetPassword(body.token, body.password);
      return { message: "Your password has been changed. Sign in with the new one." };
    },
  );

  authRoutes.get(
    "/api/invitations/:token",
    {
      summary: "What an invitation link offers",
      access: PUBLIC,
      params: z.object({ token: tokenSchema }),
      errors: { 410: "invalid, used or expired" },
    },
    ({ params }) => invitations.previewInvitation(params.token),
  );

  authRoutes.post(
    "/api/invitations/accept",
    {
      summary: "Accept an invitation by choosing a password",
      access: PUBLIC,
      body: acceptInvitationSchema,
      status: 201,
      errors: { 409: "an account exists already", 410: "invalid, used or expired" },
    },
    async ({ body, res }) => {
      const { user, sessionVersion } = await invitations.acceptInvitation(body.token, body.name, body.password);
      const csrfToken = startSession(res, cookies, user.id, sessionVersion);
      return { user, csrfToken };
    },
  );

  profileRoutes.patch("/api/me", { summary: "Change your display name", access: SIGNED_IN, body: profileSchema }, ({ user, body }) =>
    auth.updateProfile(user.id, body.name),
  );

  profileRoutes.post(
    "/api/me/password",
    { summary: "Change your password (signs out other sessions)", access: SIGNED_IN, body: changePasswordSchema },
    async ({ user, body, res }) => {
      const sessionVersion = await auth.changePassword(user.id, body.currentPassword, body.newPassword);
      const csrfToken = startSession(res, cookies, user.id, sessionVersion);
      return { csrfToken };
    },
  );
}
