import type { Metadata, Viewport } from "next";
import { Providers } from "@/components/providers/providers";
import { plexMono, plexSans } from "./fonts";
import "./globals.css";
import { paletteHex } from "@/lib/ui/palette";
// Its hash is in every page's Content-Security-Policy (proxy.ts), so it runs without a nonce.
import { CONTRAST_SCRIPT } from "@/lib/http/security-headers.mjs";

export const metadata: Metadata = {
  title: { default: "Placewright", template: "%s · Placewright" },
  description: "The placement and inspection log for structural concrete, made for the field.",
  applicationName: "Placewright",
  appleWebApp: { capable: true, title: "Placewright", statusBarStyle: "default" },
};

export const viewport: Viewport = {
  themeColor: paletteHex("ink-900"),
  width: "device-width",
  initialScale: 1,
};


export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${plexSans.variable} ${plexMono.variable}`} suppressHydrationWarning>
      <head>
        <script dangerouslySetInnerHTML={{ __html: CONTRAST_SCRIPT }} />
      </head>
      <body className="min-h-dvh font-sans antialiased">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
