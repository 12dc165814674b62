import type { Metadata, Viewport } from "next";
import type { ReactNode } from "react";
import { bodyFont } from "@/fonts";
import { AppHeader } from "@/components/app-shell/app-header";
import { QueryProvider } from "@/components/providers/query-provider";
import { currentActor } from "@/lib/auth/guards";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Meniscus", template: "%s · Meniscus" },
  description: "Practical science write-ups, checked calculations, marking and progress reports for schools.",
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  themeColor: [
    { media: "(prefers-color-scheme: light)", color: "#f6f4ef" },
    { media: "(prefers-color-scheme: dark)", color: "#11151b" },
  ],
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  const actor = await currentActor();
  return (
    <html lang="en-GB" className={bodyFont.variable}>
      <body className="min-h-screen">
        <AppHeader person={actor ? { name: actor.name, roles: actor.roles } : null} />
        <QueryProvider>
          <main id="main" className="mx-auto max-w-6xl px-4 py-6 sm:py-8">
            {children}
          </main>
        </QueryProvider>
      </body>
    </html>
  );
}
