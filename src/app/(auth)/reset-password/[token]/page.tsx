import type { Metadata } from "next";
import { AuthHeading } from "../../_components/auth-heading";
import { ResetPasswordForm } from "./reset-password-form";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <>
      <AuthHeading title="Choose a new password">
        Saving it signs out every session of your account, on every device.
      </AuthHeading>
      <ResetPasswordForm token={token} />
    </>
  );
}
