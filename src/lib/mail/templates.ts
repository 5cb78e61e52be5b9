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

export function failingPulseMail(input: {
  to: string;
  projectName: string;
  pulseName: string;
  source: string;
  pulseFigures: string;
  verdicts: { candidate: string; verdict: string; detail: string }[];
  link: string;
}): Mail {
  const worst = input.verdicts.some((v) => v.verdict === "fail") ? "fails" : "has no data";
  return {
    to: input.to,
    subject: `${input.projectName}: ${input.source} "${input.pulseName}" ${worst}`,
    text: [
      `A ${input.source} logged in "${input.projectName}" ${worst} on at least one candidate.`,
      "",
      `Pulse: ${input.pulseName} (${input.pulseFigures})`,
      ...input.verdicts.map((v) => `  ${v.candidate}: ${v.verdict}${v.detail ? ` (${v.detail})` : ""}`),
      "",
      `See it in the project: ${input.link}`,
      "",
      "A Pulsefence check is an aid to engineering judgement; validate on hardware and follow the manufacturer's",
      "guidance, the applicable safety standards, local codes and licensed practice.",
    ].join("\n"),
  };
}

export function verificationLapsedMail(input: {
  to: string;
  part: string;
  change: string;
  actorName: string;
  link: string;
}): Mail {
  return {
    to: input.to,
    subject: `${input.part} is back in draft: its data changed`,
    text: [
      `You verified ${input.part} in the library. ${input.actorName} changed it since (${input.change}), so the`,
      "verification lapsed and the part is back in draft.",
      "",
      `Check the part and its findings again, and verify it anew: ${input.link}`,
    ].join("\n"),
  };
}
