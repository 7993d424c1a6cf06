import type { Metadata, Viewport } from "next";
import { Providers } from "@/components/providers/providers";
import { plexMono, plexSans } from "./fonts";
import "./globals.css";
import { paletteHex } from "@/lib/ui/palette";

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

// Applies the saved daylight (high-contrast) mode before first paint, so the page never flashes.
const contrastScript = `try{if(localStorage.getItem("pw-contrast")==="daylight")document.documentElement.dataset.contrast="daylight"}catch(e){}`;

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${plexSans.variable} ${plexMono.variable}`} suppressHydrationWarning>
      <head>
        <script dangerouslySetInnerHTML={{ __html: contrastScript }} />
      </head>
      <body className="min-h-dvh font-sans antialiased">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
