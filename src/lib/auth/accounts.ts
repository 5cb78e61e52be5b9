// Long file: the account life cycle (sign-up, sign-in, reset, password change, tokens, sign-out everywhere) in one
// module, because each step ends or narrows access the same way (sessions, tokens, the auth memory's NOTIFY).
import "server-only";
import { and, eq, gt, isNull, lt } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import {
  apiTokens,
  authAttempts,
  invitations,
  memberships,
  passwordResets,
  pendingSignUps,
  users,
  workspaces,
} from "@/db/schema";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { isUniqueViolation } from "@/lib/library/parts";
import { enqueueMail, kickOutbox } from "@/lib/mail/outbox";
import {
  passwordResetMail,
  passwordResetNoAccountMail,
  signUpConfirmMail,
  signUpExistingAccountMail,
} from "@/lib/mail/templates";
import { forgetCachedAuth } from "./auth-memory";
import { dummyPasswordHash, hashPassword, verifyPassword } from "./password";
import { endOtherSessions } from "./session";
import { hashToken, randomToken } from "./tokens";

/** How long an invitation link works. */
export const linkLifetimeMs = 7 * 24 * 60 * 60 * 1000;
/** How long a password-reset link works: long enough to read the e-mail, short enough to be useless later. */
export const resetLinkLifetimeMs = 60 * 60 * 1000;

export function slugify(name: string): string {
  const base = name
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 40);
  return `${base || "workspace"}-${randomToken()
    .slice(0, 6)
    .toLowerCase()
    .replace(/[^a-z0-9]/g, "x")}`;
}

/** How long a sign-up's confirmation link works. */
export const signUpLinkLifetimeMs = 24 * 60 * 60 * 1000;

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Asks for a new account and its workspace. The answer must not tell whether the address already has an account,
 * by its content or its timing, so both paths do the same work: the password is hashed, one link token is made and
 * stored hashed, and one e-mail goes into the outbox in one transaction (delivered after the answer). A new address
 * gets a link that creates the account when used (`confirmSignUp`); an address with an account gets an e-mail
 * saying someone tried to sign up with it, with a reset link, and nothing about the account changes.
 */
export async function requestSignUp(input: {
  name: string;
  email: string;
  password: string;
  workspaceName: string;
}): Promise<void> {
  const passwordHash = await hashPassword(input.password);
  const token = randomToken();
  const tokenHash = hashToken(token);
  const now = Date.now();
  const existing = await db.query.users.findFirst({
    where: eq(users.email, input.email),
    columns: { id: true },
  });
  await db.transaction(async (tx) => {
    await tx.delete(pendingSignUps).where(lt(pendingSignUps.expiresAt, new Date(now)));
    if (existing) {
      await tx.insert(passwordResets).values({
        userId: existing.id,
        tokenHash,
        expiresAt: new Date(now + resetLinkLifetimeMs),
      });
      await enqueueMail(
        signUpExistingAccountMail({
          to: input.email,
          signInLink: `${env().APP_URL}/sign-in`,
          resetLink: `${env().APP_URL}/reset-password/${token}`,
        }),
        { kind: "sign-up-existing" },
        tx,
      );
    } else {
      await tx.insert(pendingSignUps).values({
        email: input.email,
        name: input.name,
        passwordHash,
        workspaceName: input.workspaceName,
        tokenHash,
        expiresAt: new Date(now + signUpLinkLifetimeMs),
      });
      await enqueueMail(
        signUpConfirmMail({
          to: input.email,
          name: input.name,
          workspaceName: input.workspaceName,
          link: `${env().APP_URL}/sign-up/confirm/${token}`,
        }),
        { kind: "sign-up" },
        tx,
      );
    }
  });
  kickOutbox();
}

/**
 * Uses a sign-up link once: creates the user and their workspace, with the user as admin (and lead rights, so one
 * person can run it), in one transaction that also consumes the link. Only the holder of the mailbox gets here, so
 * an address that got an account meanwhile (an invitation accepted) may be told so.
 */
export async function confirmSignUp(token: string): Promise<{ userId: string; workspaceId: string }> {
  return consumeSignUpLink(token).catch((error: unknown) => {
    // Two links for one address used at once: the unique e-mail lets one through; the other is told as above.
    throw isUniqueViolation(error) ? accountExists() : error;
  });
}

function accountExists(): AppError {
  return new AppError("conflict:email", "An account with this e-mail already exists. Sign in instead.");
}

function consumeSignUpLink(token: string) {
  return db.transaction(async (tx) => {
    const [pending] = await tx
      .delete(pendingSignUps)
      .where(and(eq(pendingSignUps.tokenHash, hashToken(token)), gt(pendingSignUps.expiresAt, new Date())))
      .returning();
    if (!pending) {
      throw new AppError(
        "not_found:sign-up-link",
        "This sign-up link is not valid any more: used or expired. Sign up again.",
      );
    }
    const existing = await tx.query.users.findFirst({
      where: eq(users.email, pending.email),
      columns: { id: true },
    });
    if (existing) throw accountExists();
    await tx.delete(pendingSignUps).where(eq(pendingSignUps.email, pending.email));
    return createAccount(tx, pending);
  });
}

/** Creates the user and their workspace, with the user as admin, in the caller's transaction. */
async function createAccount(
  tx: Tx,
  input: { name: string; email: string; passwordHash: string; workspaceName: string },
) {
  const [user] = await tx
    .insert(users)
    .values({ email: input.email, name: input.name, passwordHash: input.passwordHash })
    .returning({ id: users.id });
  const [workspace] = await tx
    .insert(workspaces)
    .values({ name: input.workspaceName, slug: slugify(input.workspaceName) })
    .returning({ id: workspaces.id });
  // The founder of a workspace is its only member: they hold lead rights too, so they can verify and sign alone.
  await tx
    .insert(memberships)
    .values({ workspaceId: workspace.id, userId: user.id, role: "admin", leadRights: true });
  await recordAudit(
    {
      workspaceId: workspace.id,
      actorId: user.id,
      action: "membership.created",
      subjectType: "user",
      subjectId: user.id,
      details: { role: "admin", leadRights: true, via: "sign-up" },
    },
    tx,
  );
  return { userId: user.id, workspaceId: workspace.id };
}

/** Checks e-mail and password; the same work is done for unknown e-mails so timing reveals nothing. */
export async function checkCredentials(email: string, password: string) {
  const user = await db.query.users.findFirst({ where: eq(users.email, email) });
  const ok = await verifyPassword(user?.passwordHash ?? (await dummyPasswordHash()), password);
  return ok && user ? { id: user.id } : null;
}

/** The workspace a fresh session starts in: the one asked for if a member, else the first by name. */
export async function defaultWorkspace(userId: string): Promise<string | null> {
  const rows = await db
    .select({ id: memberships.workspaceId, name: workspaces.name })
    .from(memberships)
    .innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId))
    .where(eq(memberships.userId, userId))
    .orderBy(workspaces.name)
    .limit(1);
  return rows[0]?.id ?? null;
}

/**
 * Sends a reset link when the account exists, and an e-mail saying no account uses the address when it does not.
 * Both paths do the same work on the request (one lookup, one token made, one transaction that queues one e-mail;
 * delivery happens after the answer, by the outbox), so neither the answer nor its timing tells which it was.
 */
export async function requestPasswordReset(email: string): Promise<void> {
  const user = await db.query.users.findFirst({ where: eq(users.email, email), columns: { id: true } });
  const token = randomToken();
  const tokenHash = hashToken(token);
  await db.transaction(async (tx) => {
    if (user) {
      await tx.insert(passwordResets).values({
        userId: user.id,
        tokenHash,
        expiresAt: new Date(Date.now() + resetLinkLifetimeMs),
      });
    }
    await enqueueMail(
      user
        ? passwordResetMail({ to: email, link: `${env().APP_URL}/reset-password/${token}` })
        : passwordResetNoAccountMail({ to: email, signUpLink: `${env().APP_URL}/sign-up` }),
      { kind: "password-reset" },
      tx,
    );
  });
  kickOutbox();
}

/**
 * Uses a reset link once. The link is looked up before any password is hashed, so invalid links cost nothing.
 * Then, in one transaction: the password is set, every reset link of the user stops working (an older one too),
 * every API token is revoked and the account's failed sign-ins are forgotten; finally every session ends.
 */
export async function resetPassword(token: string, password: string): Promise<{ userId: string }> {
  const tokenHash = hashToken(token);
  const open = await db.query.passwordResets.findFirst({
    where: and(
      eq(passwordResets.tokenHash, tokenHash),
      isNull(passwordResets.usedAt),
      gt(passwordResets.expiresAt, new Date()),
    ),
    columns: { id: true },
  });
  if (!open) throw resetLinkGone();
  const passwordHash = await hashPassword(password);
  const now = new Date();
  const user = await db.transaction(async (tx) => {
    const [reset] = await tx
      .update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.id, open.id), isNull(passwordResets.usedAt)))
      .returning({ userId: passwordResets.userId });
    if (!reset) throw resetLinkGone();
    await tx
      .update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAt)));
    const [updated] = await tx
      .update(users)
      .set({ passwordHash })
      .where(eq(users.id, reset.userId))
      .returning({ id: users.id, email: users.email });
    await tx
      .update(apiTokens)
      .set({ revokedAt: now })
      .where(and(eq(apiTokens.userId, reset.userId), isNull(apiTokens.revokedAt)));
    await tx
      .delete(authAttempts)
      .where(and(eq(authAttempts.kind, "sign-in"), eq(authAttempts.key, `email:${updated.email}`)));
    return updated;
  });
  forgetCachedAuth();
  await endOtherSessions(user.id, null);
  return { userId: user.id };
}

function resetLinkGone(): AppError {
  return new AppError("not_found:reset-link", "This reset link is not valid any more. Ask for a new one.");
}

/** The invitation behind a link, if it can still be used. */
export async function findOpenInvitation(token: string) {
  const [row] = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      workspaceId: invitations.workspaceId,
      workspaceName: workspaces.name,
      expiresAt: invitations.expiresAt,
    })
    .from(invitations)
    .innerJoin(workspaces, eq(workspaces.id, invitations.workspaceId))
    .where(
      and(
        eq(invitations.tokenHash, hashToken(token)),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, new Date()),
      ),
    );
  return row ?? null;
}

/**
 * Accepts an invitation once. A new e-mail gets an account (name and password required); an existing account
 * proves itself with its password. Either way the membership is added in the same transaction that uses the link.
 */
export async function acceptInvitation(input: { token: string; name?: string; password: string }) {
  const invitation = await findOpenInvitation(input.token);
  if (!invitation) {
    throw new AppError(
      "not_found:invitation",
      "This invitation link is not valid any more: used, revoked or expired.",
    );
  }
  const existing = await db.query.users.findFirst({ where: eq(users.email, invitation.email) });
  if (existing && !(await verifyPassword(existing.passwordHash, input.password))) {
    throw new AppError("invalid:password", "Wrong password for the existing account with this e-mail.", {
      details: { fieldErrors: { password: ["Wrong password for the existing account with this e-mail"] } },
    });
  }
  if (!existing && (!input.name || input.password.length < 10)) {
    throw new AppError("invalid", "Enter your name and a password of at least 10 characters.", {
      details: {
        fieldErrors: {
          ...(input.name ? {} : { name: ["Enter your name"] }),
          ...(input.password.length < 10 ? { password: ["Use at least 10 characters"] } : {}),
        },
      },
    });
  }
  const passwordHash = existing ? null : await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const [used] = await tx
      .update(invitations)
      .set({ acceptedAt: new Date() })
      .where(
        and(eq(invitations.id, invitation.id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)),
      )
      .returning({ id: invitations.id });
    if (!used) throw new AppError("not_found:invitation", "This invitation link has just been used.");
    let userId = existing?.id;
    if (!userId) {
      const [created] = await tx
        .insert(users)
        .values({ email: invitation.email, name: input.name!, passwordHash: passwordHash! })
        .returning({ id: users.id });
      userId = created.id;
    }
    await tx
      .insert(memberships)
      .values({ workspaceId: invitation.workspaceId, userId, role: invitation.role })
      .onConflictDoNothing();
    await recordAudit(
      {
        workspaceId: invitation.workspaceId,
        actorId: userId,
        action: "membership.created",
        subjectType: "user",
        subjectId: userId,
        details: { role: invitation.role, via: "invitation", invitationId: invitation.id },
      },
      tx,
    );
    return { userId, workspaceId: invitation.workspaceId };
  });
}
