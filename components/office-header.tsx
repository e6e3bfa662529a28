"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { currentNav } from "@/lib/nav";
import type { Actor } from "@/lib/schemas/session";
import { HeaderBar } from "./header-bar";

// The office pages' header, rendered once by their layout. The layout is not re-rendered when the
// user moves between its pages, so the current navigation entry follows the path here, on the client.
export function OfficeHeader({ actor }: { actor: Pick<Actor, "name" | "role"> }) {
  return <HeaderBar actor={actor} current={currentNav(actor.role, usePathname())} link={Link} />;
}
