// Whether the tablet can reach the server, as one state for the sync badge. navigator.onLine
// only says whether there is a network at all (a dead server or a captive Wi-Fi passes as
// online), so the state comes from the sync engine's last run, and the device's network only
// settles "offline". Pure: the badge and its tests call it.
import type { SyncStatus } from "./meta";

export type Connection =
  "offline" | "checking" | "not_checked" | "reachable" | "unreachable" | "server_error" | "tablet_fault";

export function connectionOf(online: boolean, status: SyncStatus): Connection {
  if (!online) return "offline";
  const outcome = status.lastOutcome;
  // A run under way after a failure (the network came back, a tap) is a fresh look at the server.
  if (status.running && outcome !== "sent" && outcome !== "refused") return "checking";
  switch (outcome) {
    case "sent":
    case "refused": // the server answered: it is there, it wants a person (sign in again)
      return "reachable";
    case "unreachable":
      return "unreachable";
    case "server_error":
      return "server_error";
    case "failed":
      return "tablet_fault";
    default:
      return "not_checked";
  }
}

export const CONNECTION_WORDS: Readonly<Record<Connection, string>> = {
  offline: "Offline · kept on this tablet",
  checking: "Checking the server…",
  not_checked: "Network on · the server not checked yet",
  reachable: "Server reachable",
  unreachable: "Network on, but the server is not reachable · kept on this tablet",
  server_error: "The server answers with an error · kept on this tablet",
  tablet_fault: "Sending stopped on this tablet · kept here",
};

const count = (n: number, one: string) => `${n} ${one}${n === 1 ? "" : "s"}`;

/** What still waits to go to the server, readings and photos alike ("" when nothing does). */
export function waitingWords(readings: number, photos: number): string {
  const parts = [readings ? count(readings, "reading") : "", photos ? count(photos, "photo") : ""].filter(Boolean);
  if (!parts.length) return "";
  return `${parts.join(" and ")} ${readings + photos === 1 ? "waits" : "wait"} to be sent`;
}
