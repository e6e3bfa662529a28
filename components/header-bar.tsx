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

export function HeaderBar({ actor, current, link: A }: Props) {
  return (
    <header className="no-print border-b-2 border-rule bg-panel">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <A href={NAV[actor.role][0].href} aria-label="Tenthwise home">
          <Wordmark />
        </A>
        <nav aria-label="Main" className="flex flex-wrap gap-1">
          {NAV[actor.role].map((item) => (
            <A
              key={item.href}
              href={item.href}
              aria-current={current === item.href ? "page" : undefined}
              className="rounded-tool px-3 py-2 font-medium text-muted hover:text-ink aria-[current=page]:bg-steel aria-[current=page]:text-steel-ink"
            >
              {item.label}
            </A>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-3">
          <span className="text-sm text-muted" data-testid="whoami">
            <span className="font-semibold text-ink">{actor.name}</span> · {ROLE_WORDS[actor.role]}
          </span>
          <ThemeToggle />
          <SignOutButton />
        </div>
      </div>
    </header>
  );
}
