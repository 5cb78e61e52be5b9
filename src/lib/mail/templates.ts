import type { Verdict } from "@/lib/soa/types";
import { verdictWords } from "@/lib/vocabulary";
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
      "The link works once and expires in 1 hour. Resetting signs out every other session.",
      "If you did not ask for this, ignore this e-mail; your password stays as it is.",
    ].join("\n"),
  };
}

const caution = [
  "A Pulsefence check is an aid to engineering judgement; validate on hardware and follow the manufacturer's",
  "guidance, the applicable safety standards, local codes and licensed practice.",
];

/** One pulse of a failing-evidence notice, with its verdict on every candidate and a link to it. */
export interface FailingPulse {
  pulseName: string;
  source: string;
  pulseFigures: string;
  verdicts: { candidate: string; verdict: Verdict; detail: string }[];
  link: string;
}

const worstWord = (p: FailingPulse) =>
  p.verdicts.some((v) => v.verdict === "fail") ? "fails" : "has no data";

/**
 * One e-mail per paste, upload or bench post, listing every pulse of it that fails or has no data on at least one
 * candidate (a table of five failing rows is one e-mail, not five).
 */
export function failingEvidenceMail(input: {
  to: string;
  projectName: string;
  pulses: FailingPulse[];
  projectLink: string;
}): Mail {
  const [first] = input.pulses;
  const many = input.pulses.length > 1;
  const subject = many
    ? `${input.projectName}: ${input.pulses.length} new pulses fail or have no data`
    : `${input.projectName}: ${first.source} "${first.pulseName}" ${worstWord(first)}`;
  const intro = many
    ? `${input.pulses.length} pulses just logged in "${input.projectName}" fail or have no data on at least one candidate.`
    : `A ${first.source} logged in "${input.projectName}" ${worstWord(first)} on at least one candidate.`;
  return {
    to: input.to,
    subject,
    text: [
      intro,
      ...input.pulses.flatMap((p) => [
        "",
        `${p.source[0].toUpperCase()}${p.source.slice(1)}: ${p.pulseName} (${p.pulseFigures}) ${worstWord(p)}`,
        ...p.verdicts.map(
          (v) => `  ${v.candidate}: ${verdictWords[v.verdict]}${v.detail ? ` (${v.detail})` : ""}`,
        ),
        `  See it: ${p.link}`,
      ]),
      "",
      `The project: ${input.projectLink}`,
      "",
      ...caution,
      "",
      "You get this because you own the project. Choose which notices you get on your account page.",
    ].join("\n"),
  };
}

/**
 * A standing decision drifted: a library change altered verdicts the decision rested on. One e-mail per change and
 * recipient, listing every changed verdict, with a link to the decision's drift section.
 */
export function decisionDriftMail(input: {
  to: string;
  projectName: string;
  chosenLabel: string;
  signedByName: string;
  signedAt: string;
  change: string;
  actorName: string;
  changes: { label: string; frozen: string; now: string }[];
  link: string;
  why: string;
}): Mail {
  return {
    to: input.to,
    subject: `${input.projectName}: the standing decision for ${input.chosenLabel} has drifted`,
    text: [
      `${input.actorName} changed the library (${input.change}). Checked again, ${input.changes.length === 1 ? "a verdict" : `${input.changes.length} verdicts`} the standing`,
      `decision of "${input.projectName}" rests on (${input.chosenLabel}, signed by ${input.signedByName} on ${input.signedAt}) changed:`,
      "",
      ...input.changes.map((c) => `  ${c.label}: ${c.frozen} when signed, ${c.now} now`),
      "",
      "The signed record keeps what it was decided on; review it and sign anew if the choice no longer holds:",
      input.link,
      "",
      ...caution,
      "",
      `You get this because ${input.why}. Choose which notices you get on your account page.`,
    ].join("\n"),
  };
}

/** The link that finishes a sign-up: the account and its workspace are created when it is used. */
export function signUpConfirmMail(input: {
  to: string;
  name: string;
  workspaceName: string;
  link: string;
}): Mail {
  return {
    to: input.to,
    subject: "Finish creating your Pulsefence workspace",
    text: [
      `Hello ${input.name},`,
      "",
      `To create the workspace "${input.workspaceName}" with this address, open this link and confirm:`,
      input.link,
      "",
      "The link works once and expires in 24 hours. If you did not sign up, ignore this e-mail; nothing is created.",
    ].join("\n"),
  };
}

/**
 * Someone tried to sign up with an address that already has an account. The sign-up form answered as for a new
 * address (it must not reveal who has an account); the owner hears of it here, with a way back in.
 */
export function signUpExistingAccountMail(input: {
  to: string;
  signInLink: string;
  resetLink: string;
}): Mail {
  return {
    to: input.to,
    subject: "Someone tried to sign up to Pulsefence with your address",
    text: [
      "Someone, perhaps you, tried to create a new Pulsefence account with this e-mail address. You already have",
      "an account, so nothing was created and nothing about your account changed.",
      "",
      `Sign in: ${input.signInLink}`,
      `Forgot your password? Choose a new one: ${input.resetLink}`,
      "",
      "The reset link works once and expires in 1 hour. If it was not you, ignore this e-mail.",
    ].join("\n"),
  };
}

/**
 * A reset was asked for an address without an account. Sent so that the form does the same work whether or not
 * the account exists (no enumeration by status or timing), and so a person who forgot which address they used
 * learns it was not this one.
 */
export function passwordResetNoAccountMail(input: { to: string; signUpLink: string }): Mail {
  return {
    to: input.to,
    subject: "Reset your Pulsefence password",
    text: [
      "Someone asked to reset the password of a Pulsefence account for this e-mail address, but no account uses it.",
      "",
      "If it was you, perhaps you signed up with another address; or create a workspace:",
      input.signUpLink,
      "",
      "If you did not ask for this, ignore this e-mail.",
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
      "",
      "You get this because you verified the part. Choose which notices you get on your account page.",
    ].join("\n"),
  };
}
