import { ROLE_LABELS, type Role } from "../../shared/roles";

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

function escapeHtml(value: string): string {
  return value
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

/** One plain layout for every message: greeting, paragraphs, one button-like link, footnote. */
function compose(opts: {
  subject: string;
  greeting: string;
  paragraphs: string[];
  link: { href: string; label: string };
  footnote: string;
}): MailContent {
  const text = [
    opts.greeting,
    "",
    ...opts.paragraphs.flatMap((p) => [p, ""]),
    `${opts.link.label}: ${opts.link.href}`,
    "",
    opts.footnote,
    "",
    "— Rillmark",
  ].join("\n");
  const html = `<!doctype html>
<html><body style="font-family: 'Noto Sans', Arial, sans-serif; color: #1f2a2e; line-height: 1.5">
<p>${escapeHtml(opts.greeting)}</p>
${opts.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join("\n")}
<p><a href="${escapeHtml(opts.link.href)}" style="display: inline-block; padding: 8px 16px; background: #0f5c6e; color: #ffffff; text-decoration: none; border-radius: 4px">${escapeHtml(opts.link.label)}</a></p>
<p style="font-size: 13px; color: #5b6b70">If the button does not work, open this address: ${escapeHtml(opts.link.href)}</p>
<p style="font-size: 13px; color: #5b6b70">${escapeHtml(opts.footnote)}</p>
<p>— Rillmark</p>
</body></html>`;
  return { subject: opts.subject, text, html };
}

export function confirmEmailMail(p: {
  baseUrl: string;
  token: string;
  name: string;
  teamName: string;
}) {
  return compose({
    subject: "Confirm your e-mail address for Rillmark",
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `Confirm this address to finish creating your Rillmark account and the team "${p.teamName}".`,
    ],
    link: { href: `${p.baseUrl}/confirm-email/${p.token}`, label: "Confirm e-mail address" },
    footnote:
      "The link works once, for 24 hours. If you did not sign up, ignore this message: no account is created.",
  });
}

/** Sent instead of a confirmation when the address already has an account (no enumeration). */
export function signUpExistingMail(p: { baseUrl: string; name: string }) {
  return compose({
    subject: "You already have a Rillmark account",
    greeting: `Hello ${p.name},`,
    paragraphs: [
      "Someone, probably you, tried to sign up for Rillmark with this address, which already has an account.",
      "Sign in instead. If you forgot your password, you can ask for a reset link on the sign-in page.",
    ],
    link: { href: `${p.baseUrl}/sign-in`, label: "Sign in" },
    footnote: "If this was not you, you can ignore this message; nothing has changed.",
  });
}

export function invitationMail(p: {
  baseUrl: string;
  token: string;
  teamName: string;
  inviterName: string;
  role: Role;
}) {
  return compose({
    subject: `${p.inviterName} invited you to ${p.teamName} on Rillmark`,
    greeting: "Hello,",
    paragraphs: [
      `${p.inviterName} invited you to join the team "${p.teamName}" on Rillmark as ${ROLE_LABELS[p.role]}.`,
      "Rillmark is where the team works out times of concentration and travel-time sheets for its drainage designs.",
    ],
    link: { href: `${p.baseUrl}/invitations/${p.token}`, label: "Accept the invitation" },
    footnote: "The link works once, for 7 days. If you did not expect it, ignore this message.",
  });
}

export function passwordResetMail(p: { baseUrl: string; token: string; name: string }) {
  return compose({
    subject: "Reset your Rillmark password",
    greeting: `Hello ${p.name},`,
    paragraphs: [
      "Someone asked to reset the password of your Rillmark account. Choose a new password with the link below.",
      "Setting a new password signs you out on every device.",
    ],
    link: { href: `${p.baseUrl}/reset-password/${p.token}`, label: "Choose a new password" },
    footnote:
      "The link works once, for 1 hour. If you did not ask for this, ignore this message; your password stays as it is.",
  });
}
