"use client";

// The last boundary: it replaces the root layout when that fails, so it renders its own document with the same look
// (tokens from globals.css, the same fonts) and shows nothing of the workspace, only the error's reference.
import localFont from "next/font/local";
import { SegmentError, type SegmentErrorProps } from "@/components/segment-error";
import "./globals.css";

const sans = localFont({
  src: "./fonts/Geist-Variable.woff2",
  variable: "--font-geist-sans",
  display: "swap",
});
const mono = localFont({
  src: "./fonts/GeistMono-Variable.woff2",
  variable: "--font-geist-mono",
  display: "swap",
});

export default function GlobalError(props: SegmentErrorProps) {
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
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
