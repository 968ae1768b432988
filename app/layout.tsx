import type { Metadata } from "next";
import Link from "next/link";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Stoke", template: "%s · Stoke" },
  description: "Fuel-switching decisions for fired plant: fuels, prices, feasibility and CO2.",
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en">
      <body>
        <header className="topbar">
          <div className="topbar-inner">
            <Link href="/" className="brand">
              Stoke<span>.</span>
            </Link>
            <nav aria-label="Main">
              <Link href="/fuels">Fuel library</Link>
              <Link href="/fuels/transfer">Import / export</Link>
            </nav>
            <span className="tagline">fuel switching for fired plant</span>
          </div>
        </header>
        <main>{children}</main>
        <footer className="site">
          Stoke is a screening and feasibility tool. Burner, fuel-train and safety decisions belong to the equipment maker, licensed
          engineers and the local authorities.
        </footer>
      </body>
    </html>
  );
}
