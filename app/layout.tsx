import "@fontsource-variable/source-sans-3";
import "@fontsource-variable/jetbrains-mono";
import "katex/dist/katex.min.css";
import "./globals.css";
import type { Metadata } from "next";
import { NoEval } from "./_components/no-eval";

// Every page is rendered per request, so Next can put the request's CSP nonce (proxy.ts) on its scripts.
export const dynamic = "force-dynamic";

export const metadata: Metadata = {
  title: { default: "Bandgate", template: "%s · Bandgate" },
  description: "Peer review and release gate for tight-binding models",
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en">
      <body className="min-h-screen bg-paper text-ink antialiased">
        <NoEval />
        {children}
      </body>
    </html>
  );
}
