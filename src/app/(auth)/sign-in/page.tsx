import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { FormMessage } from "@/components/form";
import { getPageSession } from "@/lib/auth/page";
import { AuthFooter, AuthHeading, linkClass } from "../_components/auth-heading";
import { safeNext } from "../_components/safe-next";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const query = await searchParams;
  const next = safeNext(query.next);
  if (await getPageSession()) redirect(next ?? "/app");
  return (
    <>
      <AuthHeading title="Sign in">
        Your team&apos;s parts, projects and checks are on the other side.
      </AuthHeading>
      {query.reset === "done" ? (
        <FormMessage tone="done">
          Your password is changed and every session was signed out. Sign in with the new one.
        </FormMessage>
      ) : null}
      <SignInForm next={next} />
      <AuthFooter>
        New team?{" "}
        <Link href="/sign-up" className={linkClass}>
          Create a workspace
        </Link>
      </AuthFooter>
    </>
  );
}
