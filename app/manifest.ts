import type { MetadataRoute } from "next";

// The installable bench: opens straight on the machinist's job list, full screen, in whichever
// way the tablet is held. Icons are our own mark, drawn by scripts/render-icons.ts.
export default function manifest(): MetadataRoute.Manifest {
  return {
    id: "/bench",
    name: "Tenthwise bench",
    short_name: "Tenthwise",
    description: "Log bench measurements for an engine build, with or without a network.",
    start_url: "/bench",
    scope: "/",
    display: "standalone",
    orientation: "any",
    background_color: "#f7f6f2",
    theme_color: "#1c4070",
    categories: ["productivity", "utilities"],
    icons: [
      { src: "/icons/icon.svg", sizes: "any", type: "image/svg+xml", purpose: "any" },
      { src: "/icons/icon-192.png", sizes: "192x192", type: "image/png", purpose: "any" },
      { src: "/icons/icon-512.png", sizes: "512x512", type: "image/png", purpose: "any" },
      { src: "/icons/icon-maskable-192.png", sizes: "192x192", type: "image/png", purpose: "maskable" },
      { src: "/icons/icon-maskable-512.png", sizes: "512x512", type: "image/png", purpose: "maskable" },
    ],
  };
}
