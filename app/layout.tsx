import { type Metadata } from "next";
import { headers } from "next/headers";
import { type ReactNode } from "react";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Layerwise", template: "%s · Layerwise" },
  description: "A shared record of aqueous workups with a physically based prediction of where every component goes.",
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Reading the request makes every page render per request, which the per-response script nonce of the
  // Content-Security-Policy (proxy.ts) needs: a page prerendered at build time would carry no nonce and not run.
  await headers();
  return (
    <html lang="en">
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
