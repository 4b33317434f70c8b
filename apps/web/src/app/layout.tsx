import type { Metadata, Viewport } from "next";
import Link from "next/link";
import type { ReactNode } from "react";
import { CautionFooter } from "../components/Cautions";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Contend", template: "%s · Contend" },
  description:
    "Live war-gaming workshops for contests: rivals spend money they do not get back to win one prize.",
};

// Every page is rendered per request: the server's Content-Security-Policy carries a fresh
// nonce, which Next puts on its inline scripts only when it renders the page (a prerendered
// page's scripts would carry none and be blocked).
export const dynamic = "force-dynamic";

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en">
      <body>
        <a className="skip-link" href="#main">
          Skip to content
        </a>
        <header className="site-header">
          <div className="inner">
            <Link href="/" className="brand">
              Con<span>tend</span>
            </Link>
            <nav className="site-nav" aria-label="Main">
              <Link href="/new">New session</Link>
              <Link href="/join">Join</Link>
              <Link href="/explore">Explorer</Link>
              <Link href="/calibrate">Calibrate</Link>
              <Link href="/replays">Replays</Link>
              <Link href="/scenarios">Scenarios</Link>
            </nav>
          </div>
        </header>
        <main id="main">{children}</main>
        <CautionFooter />
      </body>
    </html>
  );
}
