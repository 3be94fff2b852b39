import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { headers } from "next/headers";
import "./globals.css";

// Shipped with the app from a registry package: the build downloads nothing.
const sans = localFont({
  src: "../node_modules/@fontsource-variable/public-sans/files/public-sans-latin-wght-normal.woff2",
  variable: "--font-sans",
  weight: "100 900",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Flueward", template: "%s · Flueward" },
  description: "Venting and combustion-air checks and signed inspection records for gas-appliance installers.",
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  themeColor: "#283239",
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Reading the request headers renders every page per request, which the CSP nonce needs.
  await headers();
  return (
    <html lang="en" className={sans.variable}>
      <body className="min-h-screen font-sans">
        {children}
      </body>
    </html>
  );
}
