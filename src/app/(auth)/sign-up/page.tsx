import type { Metadata } from "next";
import Link from "next/link";
import { AuthFooter, AuthHeading, linkClass } from "../_components/auth-heading";
import { SignUpForm } from "./sign-up-form";

export const metadata: Metadata = { title: "Create a workspace" };

export default function SignUpPage() {
  return (
    <>
      <AuthHeading title="Create a workspace">
        Start your team&apos;s workspace; you will be its admin and can invite the others. We e-mail you a
        link to finish.
      </AuthHeading>
      <SignUpForm />
      <AuthFooter>
        Already in a team?{" "}
        <Link href="/sign-in" className={linkClass}>
          Sign in
        </Link>
        . Joining an existing workspace takes an invitation from its admin or lead.
      </AuthFooter>
    </>
  );
}
