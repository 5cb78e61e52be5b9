"use client";

// The last boundary: it replaces the root layout when that fails, so it renders its own document with the same look
// (tokens from globals.css, the same fonts) and shows nothing of the workspace, only the error's reference.
import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";
import { fontVariables } from "./fonts";
import "./globals.css";

export default function GlobalError(props: SegmentErrorProps) {
  return (
    <html lang="en" className={fontVariables}>
      <head>
        <title>Pulsefence</title>
      </head>
      <body className="min-h-screen bg-surface font-sans text-ink antialiased">
        <main className="px-4">
          <SegmentError {...props} what="Pulsefence" />
        </main>
      </body>
    </html>
  );
}
