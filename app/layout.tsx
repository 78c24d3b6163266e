import type { Metadata, Viewport } from "next";
import { headers } from "next/headers";
import localFont from "next/font/local";
import "./globals.css";

const inter = localFont({ src: "./fonts/inter-latin-wght-normal.woff2", variable: "--font-inter", display: "swap" });

export const metadata: Metadata = {
  title: { default: "Strutwise", template: "%s · Strutwise" },
  description: "Register, capacity checks and permits for temporary props, struts and shores.",
  manifest: "/manifest.webmanifest",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#1d4f91" };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Reading the request makes every page render per request, so each gets the nonce proxy.ts made
  // for its Content-Security-Policy (a page prerendered at build time would carry none).
  await headers();
  return (
    <html lang="en-GB" className={inter.variable}>
      <body className="min-h-dvh font-sans">{children}</body>
    </html>
  );
}
