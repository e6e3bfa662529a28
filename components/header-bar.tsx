import type { ElementType } from "react";
import { Wordmark } from "@/components/ui/logo";
import { NAV, ROLE_WORDS } from "@/lib/nav";
import type { Actor } from "@/lib/schemas/session";
import { SignOutButton } from "./sign-out-button";
import { ThemeToggle } from "./theme-toggle";

// The header every signed-in screen shares. `link` is what its links are made of: the office pages
// pass next/link (client navigation with prefetch); the bench, an offline shell, passes plain
// anchors, so leaving it is a full page load and the router's link code stays out of its first load.
type Props = { actor: Pick<Actor, "name" | "role">; current?: string; link: ElementType };

// Every link is a 44 px target. An office navigation of more than a few entries takes a row of its
// own below 1280 px, under the mark and the account, so on a tablet it stays one row and never wraps.
const navLink = [
  "inline-flex min-h-11 items-center whitespace-nowrap rounded-tool px-3 font-medium text-muted hover:text-ink",
  "aria-[current=page]:bg-steel aria-[current=page]:text-steel-ink",
].join(" ");
const ownRow = "order-last w-full xl:order-none xl:w-auto";

export function HeaderBar({ actor, current, link: A }: Props) {
  const nav = NAV[actor.role];
  return (
    <header className="no-print border-b-2 border-rule bg-panel">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <A href={nav[0].href} aria-label="Tenthwise home" className="inline-flex min-h-11 items-center">
          <Wordmark />
        </A>
        <nav aria-label="Main" className={`flex flex-nowrap gap-1 ${nav.length > 3 ? ownRow : ""}`}>
          {nav.map((item) => (
            <A
              key={item.href}
              href={item.href}
              aria-current={current === item.href ? "page" : undefined}
              className={navLink}
            >
              {item.label}
            </A>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-3">
          <A
            href="/account"
            title="Your account: password, sign out everywhere"
            className="inline-flex min-h-11 items-center rounded-tool px-1 text-sm text-muted hover:text-ink"
          >
            <span data-testid="whoami">
              <span className="font-semibold text-ink underline underline-offset-4">{actor.name}</span> ·{" "}
              {ROLE_WORDS[actor.role]}
            </span>
          </A>
          <ThemeToggle />
          <SignOutButton />
        </div>
      </div>
    </header>
  );
}
