import type { Metadata } from "next";
import { headers } from "next/headers";
import type { ReactNode } from "react";
import { fontVariables } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Pulsefence", template: "%s · Pulsefence" },
  description: "Check every stress pulse of a power transistor against its safe operating area.",
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Every page is rendered per request, so Next.js can put this request's CSP nonce (src/proxy.ts) on its scripts.
  await headers();
  return (
    <html lang="en" className={fontVariables}>
      <body className="min-h-screen bg-surface font-sans text-ink antialiased">{children}</body>
    </html>
  );
}
