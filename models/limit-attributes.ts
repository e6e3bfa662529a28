// The attributes of one spec limit, shared by SpecLimit (a template's) and JobLimit (a job's
// frozen copy). Values are in `unit`; perInchMin/perInchMax are per unit of diameter.
import { bool, decimal, enumOf, int, str } from "./columns";
import { LIMIT_TYPES } from "@/lib/domain";

export function limitAttributes() {
  return {
    characteristic: str(48),
    stationPattern: str(64),
    limitType: enumOf(LIMIT_TYPES),
    unit: str(8),
    min: decimal("min", 14, 6),
    max: decimal("max", 14, 6),
    nominal: decimal("nominal", 14, 6),
    tolPlus: decimal("tolPlus", 14, 6),
    tolMinus: decimal("tolMinus", 14, 6),
    perInchMin: decimal("perInchMin", 14, 6),
    perInchMax: decimal("perInchMax", 14, 6),
    isoClass: str(8, true),
    required: bool(true),
    gaugeKind: str(32, true),
    label: str(120, true),
    sortOrder: int(0),
    /** A starter sheet's typical value, not yet replaced by the maker's figure (lib/server/shops). */
    commonPractice: bool(false),
  };
}
