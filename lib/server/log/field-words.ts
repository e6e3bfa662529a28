import "server-only";

// The audit trail's field names in words: one table for every key an audit event's before and
// after carry (model fields and the few the events add), so "finishedBore" reads "Finished bore"
// and "limits.2.max" reads "Limits › 3 › Maximum". A key the table lacks still reads as words
// (camelCase and snake_case split, first letter capital), never as a raw key.

const FIELD_WORDS: Record<string, string> = {
  active: "Active",
  archived: "Archived",
  blockMaterial: "Block material",
  blockSerial: "Block serial",
  boltsPerRod: "Bolts per rod",
  buildKind: "Build kind",
  buildPlan: "Build plan",
  calibratedOn: "Calibrated on",
  calibrationDue: "Calibration due",
  canonicalVersion: "Record format version",
  characteristic: "Characteristic",
  closedAt: "Closed at",
  closedByReadingId: "Closed by reading",
  code: "Job code",
  corrects: "Corrects reading",
  coverageK: "Coverage factor k",
  crankSerial: "Crank serial",
  customerId: "Customer",
  customerNotified: "Customer e-mailed",
  cylinders: "Cylinders",
  deviation: "From nominal",
  deviceId: "Tablet",
  dialDeviation: "Dial reading",
  dialSetting: "Dial setting size",
  disposedAt: "Decided at",
  disposedBy: "Decided by",
  disposition: "Decision",
  dispositionReason: "Decision reason or note",
  dueDate: "Due date",
  email: "E-mail",
  engine: "Engine",
  engineId: "Engine",
  expandedU: "Expanded uncertainty U",
  finishedBore: "Finished bore",
  finishedMainJournal: "Finished main journal",
  finishedRodJournal: "Finished rod journal",
  flagsClosed: "Flags closed",
  flagsOpened: "Flags opened",
  fuel: "Fuel",
  gaugeKind: "Gauge kind",
  guardBandPolicy: "Guard band",
  hash: "Fingerprint (SHA-256)",
  headMaterial: "Head material",
  headSerials: "Head serials",
  instrumentId: "Gauge",
  isoClass: "ISO 286 class",
  jobCode: "Job code",
  jobId: "Job",
  jobStatus: "Job status",
  label: "Label",
  layout: "Layout",
  limitCount: "Number of limits",
  limitMax: "Upper limit",
  limitMin: "Lower limit",
  limitType: "Limit kind",
  limits: "Limits",
  lockedAt: "Locked at",
  lubricant: "Lubricant",
  mains: "Main bearings",
  max: "Maximum",
  min: "Minimum",
  name: "Name",
  nominal: "Nominal",
  nominalBore: "Nominal bore",
  nominalMainJournal: "Nominal main journal",
  nominalRodJournal: "Nominal rod journal",
  nominalStroke: "Nominal stroke",
  note: "Note",
  notes: "Notes",
  operation: "Operation",
  partTempC: "Part temperature (°C)",
  perInchMax: "Maximum per inch of bore",
  perInchMin: "Minimum per inch of bore",
  phone: "Phone",
  pistonMaterial: "Piston material",
  reason: "Reason",
  releaseStatus: "Release",
  required: "Required",
  resolution: "Reads to",
  ringsPerPiston: "Rings per piston",
  role: "Role",
  serial: "Serial",
  signedAt: "Signed at",
  skipReason: "Skip reason",
  skipped: "Skipped",
  specRevision: "Spec revision",
  state: "State",
  stationId: "Station",
  stationPattern: "Stations",
  status: "Status",
  takenAt: "Taken at",
  takenBy: "Taken by",
  template: "Spec sheet",
  templateId: "Spec sheet",
  title: "Title",
  tolMinus: "Tolerance below",
  tolPlus: "Tolerance above",
  typedSignature: "Signature as typed",
  unit: "Unit",
  unitSystem: "Units",
  value: "Value",
  valvesPerCylinder: "Valves per cylinder",
  verdict: "Verdict",
  voidReason: "Reason for voiding",
  voidedAt: "Voided at",
};

/** A key the table lacks, as words: "rodLength" and "rod_length" read "Rod length". */
function asWords(key: string): string {
  const spaced = key
    .replace(/_/g, " ")
    .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
    .toLowerCase()
    .trim();
  return spaced ? spaced[0].toUpperCase() + spaced.slice(1) : key;
}

/** One key in words; a list index counts from 1 ("#3"). */
export function fieldWords(key: string): string {
  if (/^\d+$/.test(key)) return `#${Number(key) + 1}`;
  return FIELD_WORDS[key] ?? asWords(key);
}

/** A dotted path of an audit change ("limits.2.max") in words ("Limits › #3 › Maximum"). */
export function pathWords(path: string): string {
  return path
    .split(".")
    .map((k) => fieldWords(k))
    .join(" › ");
}
