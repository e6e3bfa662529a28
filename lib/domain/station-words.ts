// A station id in the machinist's words, e.g. "Cylinder 3 · top of bore · axis A (thrust)": what
// the bench, the desk, the CSV and the record print beside a figure.
import { parseStationId, TORQUE_GROUP_LABELS } from "./stations";
import type { Axis, BoreDepth, ParsedStation } from "./types";

const DEPTH_WORDS: Record<BoreDepth, string> = { top: "top of bore", mid: "middle of bore", bottom: "bottom of bore" };
const BORE_AXIS: Record<Axis, string> = { A: "axis A (thrust)", B: "axis B (pin)" };
const BEARING_AXIS: Record<Axis, string> = { A: "axis A (square to cap joint)", B: "axis B (90° from A)" };
const JOURNAL_AXIS: Record<Axis, string> = { A: "axis A", B: "axis B (90° from A)" };

function valveWords(valve: string): string {
  const kind = valve.startsWith("int") ? "intake valve" : "exhaust valve";
  const n = valve.slice(3);
  return n ? `${kind} ${n}` : kind;
}

function spanWords(p: ParsedStation, axisWords: Record<Axis, string>): string[] {
  return [p.position ? `${p.position} end` : "", p.axis ? axisWords[p.axis] : ""];
}

function words(p: ParsedStation): string[] {
  switch (p.section) {
    case "bore":
      return [`Cylinder ${p.cylinder}`, p.depth ? DEPTH_WORDS[p.depth] : "", p.axis ? BORE_AXIS[p.axis] : ""];
    case "main":
      return [`Main journal ${p.main}`, ...spanWords(p, JOURNAL_AXIS)];
    case "rod":
      return [`Rod journal ${p.journal}`, ...spanWords(p, JOURNAL_AXIS)];
    case "main-brg":
      return [`Main bearing ${p.main} (installed)`, ...spanWords(p, BEARING_AXIS)];
    case "rod-brg":
      return [`Rod ${p.rod} bearing (installed)`, ...spanWords(p, BEARING_AXIS)];
    case "skirt":
      return [`Piston ${p.cylinder}`, "skirt at the maker's gauge point"];
    case "ring-gap":
      return [`Cylinder ${p.cylinder}`, `${p.ring} ring end gap`];
    case "side":
      return [`Rod ${p.rod}`, "side clearance"];
    case "end-play":
      return ["Crankshaft", "end play"];
    case "bolt":
      return [
        `Rod ${p.rod}`,
        `bolt ${p.bolt}`,
        p.boltState ? (p.boltState === "free" ? "free length" : "torqued length") : "",
      ];
    case "deck":
      return [p.bank === "block" ? "Deck" : `${p.bank === "left" ? "Left" : "Right"} bank deck`, `${p.corner} corner`];
    case "lash":
      return [`Cylinder ${p.cylinder}`, `${valveWords(p.valve ?? "")} lash`];
    case "torque":
      return ["Torque", TORQUE_GROUP_LABELS[p.group ?? ""] ?? (p.group ?? "").replace(/-/g, " ")];
  }
}

/** Words for the machinist, e.g. "Cylinder 3 · top of bore · axis A (thrust)". */
export function describeStation(id: string): string {
  return words(parseStationId(id)).filter(Boolean).join(" · ");
}
