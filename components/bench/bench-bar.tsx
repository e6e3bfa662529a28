"use client";

import { StorageNotice } from "./storage-notice";
import { SyncBadge } from "./sync-badge";
import { UpdateBanner } from "./update-banner";

// The strip under the header on every bench screen: sync state, storage promise, app update.
export function BenchBar() {
  return (
    <div className="no-print border-b-2 border-rule bg-paper">
      <div className="mx-auto flex max-w-7xl flex-col gap-1 px-4 py-1.5">
        <SyncBadge />
        <StorageNotice />
        <UpdateBanner />
      </div>
    </div>
  );
}
