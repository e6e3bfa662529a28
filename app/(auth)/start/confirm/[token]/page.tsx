import { Wordmark } from "@/components/ui/logo";
import { ConfirmShop } from "@/components/shops/confirm-shop";

export const metadata = { title: "Open your shop" };

export default async function ConfirmShopPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-8 px-6 py-10">
      <Wordmark className="text-ink" />
      <ConfirmShop token={decodeURIComponent(token)} />
    </main>
  );
}
