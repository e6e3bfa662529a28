import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

// Loading, failed and empty states for the release and audit screens.
export function Loading({ what }: { what: string }) {
  return (
    <p className="rounded-tool border-2 border-dashed border-rule p-6 text-muted" role="status">
      Loading {what}…
    </p>
  );
}

export function LoadFailed({ what, error, retry }: { what: string; error: Error; retry: () => void }) {
  return (
    <Notice tone="error" title={`Could not load ${what}`}>
      <p>{error.message}</p>
      <Button tone="quiet" className="mt-2" onClick={retry}>
        Try again
      </Button>
    </Notice>
  );
}

export function Empty({ children }: { children: React.ReactNode }) {
  return <p className="rounded-tool border-2 border-dashed border-rule p-6 text-muted">{children}</p>;
}
