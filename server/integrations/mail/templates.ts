/** Wording of the mails Cellarpact sends. Plain text keeps them readable in any client. */
import { ROLE_LABELS, type Role } from "../../../shared/auth/roles.ts";
import type { OutgoingMail } from "./outbox.ts";

export function invitationMail(p: {
  to: string;
  organisationName: string;
  role: Role;
  inviterName: string;
  link: string;
  expiresDays: number;
}): OutgoingMail {
  return {
    to: p.to,
    subject: `You are invited to ${p.organisationName} on Cellarpact`,
    text: [
      `Hello,`,
      ``,
      `${p.inviterName} has invited you to join ${p.organisationName} on Cellarpact as ${ROLE_LABELS[p.role]}.`,
      `Cellarpact is where buyers and producers agree wine specifications and check each lot against them.`,
      ``,
      `Accept the invitation and choose your password here:`,
      p.link,
      ``,
      `The link works once and expires in ${p.expiresDays} days. If you did not expect this, ignore this mail.`,
    ].join("\n"),
  };
}

export function passwordResetMail(p: { to: string; name: string; link: string; expiresMinutes: number }): OutgoingMail {
  return {
    to: p.to,
    subject: "Reset your Cellarpact password",
    text: [
      `Hello ${p.name},`,
      ``,
      `Someone asked to reset the password of your Cellarpact account. To choose a new password, open:`,
      p.link,
      ``,
      `The link works once and expires in ${p.expiresMinutes} minutes. If you did not ask for this, ignore this mail; your password stays as it is.`,
    ].join("\n"),
  };
}

export function organisationWelcomeMail(p: { to: string; organisationName: string; link: string; expiresDays: number }): OutgoingMail {
  return {
    to: p.to,
    subject: `${p.organisationName} is ready on Cellarpact`,
    text: [
      `Hello,`,
      ``,
      `An account for ${p.organisationName} has been opened on Cellarpact and you are its administrator.`,
      `Set your password and invite your colleagues here:`,
      p.link,
      ``,
      `The link works once and expires in ${p.expiresDays} days.`,
    ].join("\n"),
  };
}
