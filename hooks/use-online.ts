"use client";

import { useSyncExternalStore } from "react";

// navigator.onLine as React state. It only knows whether there is a network at all ("lie-fi"
// passes as online), so the sync badge shows the last real answer from the server beside it.
function subscribe(onChange: () => void) {
  window.addEventListener("online", onChange);
  window.addEventListener("offline", onChange);
  return () => {
    window.removeEventListener("online", onChange);
    window.removeEventListener("offline", onChange);
  };
}

export function useOnline(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => navigator.onLine,
    () => true,
  );
}
