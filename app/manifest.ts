import type { MetadataRoute } from "next";
import { paletteHex } from "@/lib/ui/palette";

export default function manifest(): MetadataRoute.Manifest {
  return {
    name: "Placewright",
    short_name: "Placewright",
    description: "Placement and inspection log for structural concrete, offline first.",
    start_url: "/today",
    scope: "/",
    display: "standalone",
    orientation: "any",
    background_color: paletteHex("ink-50"),
    theme_color: paletteHex("ink-900"),
    categories: ["business", "productivity"],
    icons: [
      { src: "/icons/icon-192.png", sizes: "192x192", type: "image/png", purpose: "any" },
      { src: "/icons/icon-512.png", sizes: "512x512", type: "image/png", purpose: "any" },
      { src: "/icons/maskable-192.png", sizes: "192x192", type: "image/png", purpose: "maskable" },
      { src: "/icons/maskable-512.png", sizes: "512x512", type: "image/png", purpose: "maskable" },
    ],
  };
}
