import type { Metadata } from "next";
import { LinkPage } from "@/components/account/link-page";
import { linkPageState } from "@/lib/server/accounts/passwords";

// The token is in this page's address: no Referer may carry it to another site.
export const metadata: Metadata = { title: "Choose your password", referrer: "no-referrer" };

export default async function SetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return <LinkPage kind="invitation" token={token} state={await linkPageState("invitation", token)} />;
}
