import { type Metadata } from "next";
import { type ReactNode } from "react";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Layerwise", template: "%s · Layerwise" },
  description: "A shared record of aqueous workups with a physically based prediction of where every component goes.",
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en">
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
