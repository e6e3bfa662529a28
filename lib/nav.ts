import type { Role } from "@/lib/schemas/enums";

// Each role's navigation. The first entry is that role's home (see ROLE_HOME).
export const NAV: Record<Role, { href: string; label: string }[]> = {
  machinist: [{ href: "/bench", label: "Bench" }],
  lead: [
    { href: "/desk", label: "Jobs" },
    { href: "/desk/flags", label: "Flags" },
    { href: "/desk/specs", label: "Spec sheets" },
    { href: "/release", label: "Release" },
    { href: "/admin/gauges", label: "Gauges" },
    { href: "/audit", label: "Audit" },
    { href: "/bench", label: "Bench" },
  ],
  inspector: [
    { href: "/release", label: "Release" },
    { href: "/desk/flags", label: "Flags" },
    { href: "/admin/gauges", label: "Gauges" },
    { href: "/audit", label: "Audit" },
  ],
  admin: [
    { href: "/admin", label: "Shop" },
    { href: "/admin/users", label: "Users" },
    { href: "/admin/gauges", label: "Gauges" },
    { href: "/desk", label: "Jobs" },
    { href: "/desk/specs", label: "Spec sheets" },
    { href: "/admin/mail", label: "Mail" },
    { href: "/audit", label: "Audit" },
  ],
};

export const ROLE_WORDS: Record<Role, string> = {
  machinist: "Machinist",
  lead: "Lead builder",
  inspector: "Inspector",
  admin: "Shop admin",
};

/** The request header proxy.ts sets on office pages: their path, for the sign-in page to lead back to. */
export const PAGE_PATH_HEADER = "x-tenthwise-page";

/**
 * The navigation entry a path belongs to: the longest entry the path is under. An inspector opens a
 * job's maps from the release page, so those count as Release for them.
 */
export function currentNav(role: Role, path: string): string | undefined {
  const under = (href: string) => path === href || path.startsWith(`${href}/`);
  const hit = NAV[role].filter((n) => under(n.href)).sort((a, b) => b.href.length - a.href.length)[0];
  if (hit) return hit.href;
  if (role === "inspector" && path.startsWith("/desk/jobs/")) return "/release";
  return undefined;
}
