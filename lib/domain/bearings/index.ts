// Bearing shell selection: the public face. Pure, like the rest of the core.
export * from "./types";
export { shellWalls } from "./walls";
export { installedClearance, type ClearanceStack } from "./predict";
export { selectShells } from "./select";
export { evaluateChoices, movedJournals, type MovedJournal } from "./choices";
export { ADJUSTING_SET_REACH } from "./advice";
export * from "./grades";
export * from "./words";
