import { z } from "zod";
import type { RouteRegistry } from "../http/route-registry.ts";
import { PUBLIC, SIGNED_IN } from "../http/access.ts";
import { endSession, startSession, type CookieSettings } from "../http/session.ts";
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
  r.add(
    {
      method: "post",
      path: "/api/auth/sign-in",
      tag: "auth",
      summary: "Sign in with e-mail and password",
      access: PUBLIC,
      body: signInSchema,
      errors: { 401: "wrong e-mail or password (same message for both)", 429: "too many failed attempts" },
    },
    async ({ body, res }) => {
      const { user, sessionVersion } = await auth.signIn(body.email, body.password);
      const csrfToken = startSession(res, cookies, user.id, sessionVersion);
      return { user, csrfToken };
    },
  );

  r.add(
    { method: "post", path: "/api/auth/sign-out", tag: "auth", summary: "Sign out everywhere", access: SIGNED_IN },
    async ({ user, res }) => {
      await auth.signOut(user.id);
      endSession(res, cookies);
    },
  );

  r.add({ method: "get", path: "/api/auth/session", tag: "auth", summary: "The current user, or null", access: PUBLIC }, ({ req }) => ({
    user: req.user ?? null,
    csrfToken: req.user && req.sessionId ? csrfTokenFor(cookies.secret, req.sessionId) : null,
  }));

  r.add(
    {
      method: "post",
      path: "/api/auth/password-reset/request",
      tag: "auth",
      summary: "Mail a one-time password reset link",
      access: PUBLIC,
      body: passwordResetRequestSchema,
      status: 202,
    },
    async ({ body }) => {
      await auth.requestPasswordReset(body.email);
      return { message: "If an account uses this address, a reset link is on its way." };
    },
  );

  r.add(
    {
      method: "post",
      path: "/api/auth/password-reset",
      tag: "auth",
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

  r.add(
    {
      method: "get",
      path: "/api/invitations/:token",
      tag: "auth",
      summary: "What an invitation link offers",
      access: PUBLIC,
      params: z.object({ token: tokenSchema }),
      errors: { 410: "invalid, used or expired" },
    },
    ({ params }) => invitations.previewInvitation(params.token),
  );

  r.add(
    {
      method: "post",
      path: "/api/invitations/accept",
      tag: "auth",
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

  r.add(
    { method: "patch", path: "/api/me", tag: "profile", summary: "Change your display name", access: SIGNED_IN, body: profileSchema },
    ({ user, body }) => auth.updateProfile(user.id, body.name),
  );

  r.add(
    {
      method: "post",
      path: "/api/me/password",
      tag: "profile",
      summary: "Change your password (signs out other sessions)",
      access: SIGNED_IN,
      body: changePasswordSchema,
    },
    async ({ user, body, res }) => {
      const sessionVersion = await auth.changePassword(user.id, body.currentPassword, body.newPassword);
      const csrfToken = startSession(res, cookies, user.id, sessionVersion);
      return { csrfToken };
    },
  );
}
