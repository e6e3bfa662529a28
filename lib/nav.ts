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
  ],
};

export const ROLE_WORDS: Record<Role, string> = {
  machinist: "Machinist",
  lead: "Lead builder",
  inspector: "Inspector",
  admin: "Shop admin",
};
