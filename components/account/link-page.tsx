import { Notice } from "@/components/ui/notice";
import type { LinkPageState } from "@/lib/schemas/password";
import { AuthFrame, bigLink } from "./auth-frame";
import { LinkPasswordForm } from "./link-password-form";

type Kind = "invitation" | "password_reset";

const TITLE: Record<Kind, string> = { invitation: "Choose your password", password_reset: "Choose a new password" };

// The page an e-mailed link opens: the form when the link can be used, else the words saying why
// not and what to do instead. Looking does not use the link up; saving the password does.
export function LinkPage({ kind, token, state }: { kind: Kind; token: string; state: LinkPageState }) {
  const holder = "holder" in state ? state.holder : null;
  return (
    <AuthFrame title={TITLE[kind]}>
      {holder ? (
        <>
          {kind === "invitation" && (
            <p>
              Welcome to {holder.shopName}, {holder.name}. Choose the password you will sign in with.
            </p>
          )}
          <LinkPasswordForm kind={kind} token={token} email={holder.email} />
        </>
      ) : (
        <div className="flex flex-col gap-4" data-testid="link-refused">
          <Notice tone="error" title="This link cannot be used">
            {"problem" in state ? state.problem : null}
          </Notice>
          <a href={kind === "invitation" ? "/sign-in" : "/forgot-password"} className={bigLink}>
            {kind === "invitation" ? "Go to sign-in" : "Ask for a new reset link"}
          </a>
        </div>
      )}
    </AuthFrame>
  );
}
