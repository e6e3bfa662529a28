import { ChangePasswordForm } from "@/components/account/change-password-form";
import { SignOutEverywhere } from "@/components/account/sign-out-everywhere";
import { Notice } from "@/components/ui/notice";
import { ROLE_WORDS } from "@/lib/nav";
import { requirePageActor, ROLE_HOME } from "@/lib/server/core/access";

export const metadata = { title: "Your account" };

// Everyone's own account: who they are, their password, and signing out on every device. While a
// temporary password from an admin is owed a change, every other screen sends them here.
export default async function AccountPage() {
  const actor = await requirePageActor();
  const owed = actor.mustChangePassword ?? false;
  return (
    <main className="mx-auto flex max-w-2xl flex-col gap-6 px-4 py-6">
      <div>
        <h1 className="text-2xl font-semibold">Your account</h1>
        <p className="text-muted">
          {actor.name} · {actor.email} · {ROLE_WORDS[actor.role]}
        </p>
      </div>
      {owed && (
        <div data-testid="password-change-owed">
          <Notice tone="caution" title="Choose your own password to go on">
            The password you signed in with was set by an admin for one sign-in. Type it as the current password, then
            choose one only you know.
          </Notice>
        </div>
      )}
      <section className="flex flex-col gap-4 rounded-tool border-2 border-rule bg-panel p-5">
        <h2 className="text-xl font-semibold">Password</h2>
        <ChangePasswordForm email={actor.email} then={owed ? ROLE_HOME[actor.role] : undefined} />
      </section>
      {!owed && (
        <section className="flex flex-col gap-3 rounded-tool border-2 border-rule bg-panel p-5">
          <h2 className="text-xl font-semibold">Signed in elsewhere?</h2>
          <p className="text-muted">
            Left yourself signed in on a shop tablet or another computer? Sign out everywhere, then sign in again here.
          </p>
          <SignOutEverywhere />
        </section>
      )}
    </main>
  );
}
