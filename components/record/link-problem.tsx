import { Wordmark } from "@/components/ui/logo";
import { Notice } from "@/components/ui/notice";
import type { ShopContact } from "@/lib/schemas/user";

// What a customer sees when a record link has expired or is not one of ours, and whom to ask.
export type LinkProblemProps = { kind: "expired"; expiredOn: string; shop: ShopContact | null } | { kind: "invalid" };

export function LinkProblem(props: LinkProblemProps) {
  const shop = props.kind === "expired" ? props.shop : null;
  const reach = shop ? [shop.phone, shop.email].filter(Boolean).join(" or ") : "";
  return (
    <main className="mx-auto flex max-w-2xl flex-col gap-6 px-4 py-10">
      <Wordmark />
      <h1 className="text-3xl font-semibold">
        {props.kind === "expired" ? "This link has expired" : "This link does not work"}
      </h1>
      <Notice
        tone="error"
        title={
          props.kind === "expired"
            ? `The link stopped working on ${props.expiredOn}`
            : "The link is incomplete or has been changed"
        }
      >
        {props.kind === "expired"
          ? "Links to a build record work for a limited time, so an old e-mail cannot open it for ever. " +
            "The record itself is kept by the shop."
          : "It may have been cut short when it was copied. Open it again from the e-mail, or copy the whole link."}
      </Notice>
      <section className="rounded-tool border-2 border-rule bg-panel p-4">
        <h2 className="mb-2 text-xl font-semibold">Who can help</h2>
        {shop ? (
          <p data-testid="ask-shop">
            Ask <strong>{shop.name}</strong>
            {reach ? <> ({reach})</> : null} to send you a new link to the build record.
          </p>
        ) : (
          <p data-testid="ask-shop">Ask the engine shop that sent you the link to send a new one.</p>
        )}
      </section>
    </main>
  );
}
