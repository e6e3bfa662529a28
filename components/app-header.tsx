import Link from "next/link";
import type { Actor } from "@/lib/schemas/session";
import { HeaderBar } from "./header-bar";

export function AppHeader({ actor, current }: { actor: Actor; current?: string }) {
  return <HeaderBar actor={actor} current={current} link={Link} />;
}
