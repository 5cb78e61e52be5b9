import Link from "next/link";
import type { ReactNode } from "react";
import { Wordmark } from "@/components/wordmark";

/** Signed-out pages: one centred card under the wordmark. */
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center px-4 pt-[12vh] pb-12">
      <Link href="/" className="rounded-sm text-ink" aria-label="Pulsefence home">
        <Wordmark className="text-lg" />
      </Link>
      <main className="mt-6 w-full max-w-[26rem] rounded-lg border border-line bg-panel px-6 py-6 shadow-[0_1px_2px_rgb(0_0_0/0.04)]">
        {children}
      </main>
      <p className="mt-6 max-w-[26rem] text-center text-xs text-ink-faint">
        Each workspace sees only its own library, projects and files.
      </p>
    </div>
  );
}
