import type { Metadata } from "next";
import localFont from "next/font/local";
import "./globals.css";
import { Providers } from "@/components/layout/providers";

const inter = localFont({
  src: "../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2",
  variable: "--font-inter",
  weight: "100 900",
  display: "swap",
});

/** Every page renders per request, so Next can put this request's CSP nonce on its inline scripts (see proxy.ts). */
export const dynamic = "force-dynamic";

export const metadata: Metadata = {
  title: { default: "Sievewright", template: "%s · Sievewright" },
  description: "Plan, sign off and run dielectrophoretic cell-sorting protocols.",
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-screen font-sans">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
