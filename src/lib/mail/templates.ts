import type { Mail } from "./mailer";

// Plain-text e-mails, short and specific: what happened, what to do, when the link stops working.

export function invitationMail(input: {
  to: string;
  workspaceName: string;
  inviterName: string;
  role: string;
  link: string;
}): Mail {
  return {
    to: input.to,
    subject: `${input.inviterName} invited you to ${input.workspaceName} on Pulsefence`,
    text: [
      `${input.inviterName} invited you to join the workspace "${input.workspaceName}" on Pulsefence as ${input.role}.`,
      "",
      `Accept the invitation: ${input.link}`,
      "",
      "The link works once and expires in 7 days. If you did not expect this, ignore this e-mail.",
    ].join("\n"),
  };
}

export function passwordResetMail(input: { to: string; link: string }): Mail {
  return {
    to: input.to,
    subject: "Reset your Pulsefence password",
    text: [
      "Someone asked to reset the password of your Pulsefence account.",
      "",
      `Choose a new password: ${input.link}`,
      "",
      "The link works once and expires in 7 days. Resetting signs out every other session.",
      "If you did not ask for this, ignore this e-mail; your password stays as it is.",
    ].join("\n"),
  };
}
