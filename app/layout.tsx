import type { Metadata } from "next";
import Link from "next/link";
import "./globals.css";
import "./studies/decision.css";
import { NavLink } from "./_ui/NavLink";
import { pageActions, pageUser } from "./_auth/page-user";
import { SignOutButton } from "./_auth/SignOutButton";
import { stokeMode, trashEnabled } from "@/lib/services/mode";

export const metadata: Metadata = {
  title: { default: "Stoke", template: "%s · Stoke" },
  description: "Fuel-switching decisions for fired plant: fuels, prices, feasibility and CO2.",
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  const team = stokeMode() === "team";
  const [user, can] = team ? await Promise.all([pageUser(), pageActions()]) : [null, null];
  return (
    <html lang="en">
      <body>
        <header className="topbar">
          <div className="topbar-inner">
            <Link href="/" className="brand">
              Stoke<span>.</span>
            </Link>
            <nav aria-label="Main">
              <NavLink href="/studies">Studies</NavLink>
              <NavLink href="/plants">Plants</NavLink>
              <NavLink href="/fuels" not={["/fuels/transfer"]}>
                Fuel library
              </NavLink>
              <NavLink href="/fuels/transfer" exact>
                {can && !can.importLibrary ? "Export" : "Import / export"}
              </NavLink>
              {trashEnabled() && (!team || user) && <NavLink href="/trash">Trash</NavLink>}
              {user && can?.manageAccounts && <NavLink href="/accounts">Accounts</NavLink>}
            </nav>
            {user ? (
              <span className="account" data-testid="signed-in">
                <Link href="/account" style={{ color: "inherit" }}>
                  {user.name} <span className="muted">({user.role})</span>
                </Link>
                <SignOutButton />
              </span>
            ) : (
              <span className="tagline">fuel switching for fired plant</span>
            )}
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
