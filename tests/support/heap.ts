// Live heap, measured after a full garbage collection, so what a stream holds on to is told apart
// from garbage waiting to be collected. The gc hook is switched on at run time (no flag needed).
import { setFlagsFromString } from "node:v8";
import { runInNewContext } from "node:vm";

setFlagsFromString("--expose-gc");
const gc = runInNewContext("gc") as () => void;

/** Bytes of live heap after a full collection. */
export function liveHeap(): number {
  gc();
  gc();
  return process.memoryUsage().heapUsed;
}

/**
 * Reads a byte stream to its end, taking the live heap every `every` pieces; answers the text and
 * the most the live heap grew above where it stood before reading began.
 */
export async function readMeasured(
  body: ReadableStream<Uint8Array>,
  every = 4,
): Promise<{ bytes: Uint8Array[]; growth: number }> {
  const base = liveHeap();
  let peak = base;
  const bytes: Uint8Array[] = [];
  const reader = body.getReader();
  for (let n = 1; ; n++) {
    const { done, value } = await reader.read();
    if (done) break;
    bytes.push(value);
    if (n % every === 0) peak = Math.max(peak, liveHeap());
  }
  return { bytes, growth: peak - base };
}
