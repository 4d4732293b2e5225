import "@fontsource-variable/source-sans-3";
import "@fontsource-variable/jetbrains-mono";
import "katex/dist/katex.min.css";
import "./globals.css";
import type { Metadata } from "next";

export const metadata: Metadata = {
  title: { default: "Bandgate", template: "%s · Bandgate" },
  description: "Peer review and release gate for tight-binding models",
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en">
      <body className="min-h-screen bg-paper text-ink antialiased">{children}</body>
    </html>
  );
}
