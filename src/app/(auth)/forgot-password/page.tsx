import type { Metadata } from "next";
import Link from "next/link";
import { AuthFooter, AuthHeading, linkClass } from "../_components/auth-heading";
import { ForgotPasswordForm } from "./forgot-password-form";

export const metadata: Metadata = { title: "Forgot password" };

export default function ForgotPasswordPage() {
  return (
    <>
      <AuthHeading title="Reset your password">
        Enter the e-mail of your account. We send a link to choose a new password; it works once and expires
        in 7 days.
      </AuthHeading>
      <ForgotPasswordForm />
      <AuthFooter>
        Remembered it?{" "}
        <Link href="/sign-in" className={linkClass}>
          Sign in
        </Link>
      </AuthFooter>
    </>
  );
}
