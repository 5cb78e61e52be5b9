import type { Metadata } from "next";
import { AuthHeading } from "../../../_components/auth-heading";
import { ConfirmSignUpForm } from "./confirm-sign-up-form";

export const metadata: Metadata = { title: "Finish creating your workspace" };

export default async function ConfirmSignUpPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <>
      <AuthHeading title="Finish creating your workspace">
        Your address is confirmed by this link. Create the workspace to start; you will be its admin.
      </AuthHeading>
      <ConfirmSignUpForm token={token} />
    </>
  );
}
