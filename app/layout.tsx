import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
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

/**
 * Pages that read the session (every signed-in page) render per request and carry the proxy's
 * nonce; a page that reads nothing of the request (the sign-in page) is prerendered at build time
 * and the proxy allows its inline scripts by hash (lib/api/csp.ts).
 */
export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={sans.variable}>
      <body className="min-h-screen font-sans">
        {children}
      </body>
    </html>
  );
}
