"use client";

import { createContext, useContext } from "react";
import type { BenchDb } from "@/lib/offline/db";
import type { DeviceActor } from "@/lib/offline/meta";
import type { EngineHandle } from "@/lib/offline/engine-handle";

// What every bench screen shares once the shell has booted: the tablet's database, the one sync
// engine, who is measuring (from the server, or remembered when offline) and the device id.
export interface Bench {
  db: BenchDb;
  engine: EngineHandle;
  actor: DeviceActor;
  deviceId: string;
}

const BenchContext = createContext<Bench | null>(null);
export const BenchProvider = BenchContext.Provider;

export function useBench(): Bench {
  const bench = useContext(BenchContext);
  if (!bench) throw new Error("Bench screens render inside <BenchShell>");
  return bench;
}
