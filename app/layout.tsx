import type { Metadata, Viewport } from "next";
import { headers } from "next/headers";
import localFont from "next/font/local";
import { NONCE_HEADER } from "@/lib/security-headers";
import { Providers } from "./providers";
import "./globals.css";

const sans = localFont({
  src: "./fonts/inter-latin-wght.woff2",
  weight: "100 900",
  variable: "--font-sans",
  display: "swap",
});
const mono = localFont({
  src: "./fonts/jetbrains-mono-latin-wght.woff2",
  weight: "100 800",
  variable: "--font-mono",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Tenthwise", template: "%s · Tenthwise" },
  description: "Bench measurement records for engine builds: readings, limits, reviews and release.",
  applicationName: "Tenthwise",
  icons: { icon: "/icons/icon.svg", apple: "/icons/icon-192.png" },
};

export const viewport: Viewport = {
  themeColor: "#1c4070",
  width: "device-width",
  initialScale: 1,
};

// Applies the saved theme before first paint so the dim bench theme does not flash.
const themeScript = `try{if(localStorage.getItem("tw-theme")==="dim")document.documentElement.classList.add("dim")}catch(e){}`;

// Reading the request renders every page per request, which the script nonce needs (a page
// prerendered at build time could not carry one; see proxy.ts and lib/security-headers.ts).
export default async function RootLayout({ children }: { children: React.ReactNode }) {
  const nonce = (await headers()).get(NONCE_HEADER) ?? undefined;
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`} suppressHydrationWarning>
      <head>
        <script nonce={nonce} dangerouslySetInnerHTML={{ __html: themeScript }} />
      </head>
      <body className="min-h-dvh antialiased">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
