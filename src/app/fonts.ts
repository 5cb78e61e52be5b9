import localFont from "next/font/local";

// The app's two typefaces, shipped with it (no font is fetched at build or run time): the root layout and the
// last-resort error page both put their variables on <html>.

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

/** The class names that define the font variables globals.css reads. */
export const fontVariables = `${sans.variable} ${mono.variable}`;
