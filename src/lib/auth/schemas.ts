import { z } from "zod";
import { roles } from "./permissions";

// Shared by the forms (react-hook-form resolver) and the route handlers.

export const email = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email({ message: "Enter a valid e-mail address" }));
export const password = z
  .string()
  .min(10, { message: "Use at least 10 characters" })
  .max(200, { message: "Use at most 200 characters" });
const personName = z.string().trim().min(1, { message: "Enter your name" }).max(100);

export const signUpSchema = z.object({
  name: personName,
  email,
  password,
  workspaceName: z.string().trim().min(2, { message: "Name your team's workspace" }).max(100),
});

export const signInSchema = z.object({
  email,
  password: z.string().min(1, { message: "Enter your password" }),
});

export const forgotPasswordSchema = z.object({ email });

export const resetPasswordSchema = z.object({ token: z.string().min(20), password });

export const confirmSignUpSchema = z.object({ token: z.string().min(20).max(200) });

export const acceptInvitationSchema = z.object({
  token: z.string().min(20),
  name: personName.optional(),
  password: z.string().min(1, { message: "Enter a password" }),
});

export const inviteSchema = z.object({ email, role: z.enum(roles) });

export const changeRoleSchema = z
  .object({ role: z.enum(roles).optional(), leadRights: z.boolean().optional() })
  .refine((v) => v.role !== undefined || v.leadRights !== undefined, {
    message: "Send a role, lead rights, or both.",
  });

export const switchWorkspaceSchema = z.object({ workspaceId: z.uuid() });

export const profileSchema = z.object({ name: personName });

export const changePasswordSchema = z.object({
  currentPassword: z.string().min(1, { message: "Enter your current password" }),
  newPassword: password,
});

export const createTokenSchema = z.object({
  name: z.string().trim().min(1, { message: "Name the token, e.g. the bench it runs on" }).max(60),
});

/** The optional e-mails a person chooses; account mail (invitations, reset and sign-up links) is always sent. */
export const noticePreferencesSchema = z.object({
  failingEvidence: z.boolean(),
  decisionDrift: z.boolean(),
  verificationLapsed: z.boolean(),
});

/** The reset form's own field (the token travels beside it). */
export const resetPasswordFormSchema = resetPasswordSchema.pick({ password: true });

/** Accepting an invitation: a new account needs a name and a real password. */
export const inviteNewAccountSchema = z.object({ name: profileSchema.shape.name, password });

/** Accepting an invitation into an existing account: it only proves itself with its password. */
export const inviteExistingAccountSchema = z.object({
  name: z.string(),
  password: z.string().min(1, { message: "Enter your password" }),
});
