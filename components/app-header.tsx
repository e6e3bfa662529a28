import Link from "next/link";
import { Wordmark } from "@/components/ui/logo";
import { NAV, ROLE_WORDS } from "@/lib/nav";
import type { Actor } from "@/lib/server/access";
import { SignOutButton } from "./sign-out-button";
import { ThemeToggle } from "./theme-toggle";

export function AppHeader({ actor, current }: { actor: Actor; current?: string }) {
  return (
    <header className="no-print border-b-2 border-rule bg-panel">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href={NAV[actor.role][0].href} aria-label="Tenthwise home">
          <Wordmark />
        </Link>
        <nav aria-label="Main" className="flex flex-wrap gap-1">
          {NAV[actor.role].map((item) => (
            <Link
              key={item.href}
              href={item.href}
              aria-current={current === item.href ? "page" : undefined}
              className="rounded-tool px-3 py-2 font-medium text-muted hover:text-ink aria-[current=page]:bg-steel aria-[current=page]:text-steel-ink"
            >
              {item.label}
            </Link>
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
