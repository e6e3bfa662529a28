import type { Metadata } from "next";
import { LinkPage } from "@/components/account/link-page";
import { linkPageState } from "@/lib/server/accounts/passwords";

// The token is in this page's address: no Referer may carry it to another site.
export const metadata: Metadata = { title: "Choose a new password", referrer: "no-referrer" };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return <LinkPage kind="password_reset" token={token} state={await linkPageState("password_reset", token)} />;
}
