// Gauge capability studies: the public face. Pure, like the rest of the core.
export * from "./types";
export { DEFAULT_STUDY_THRESHOLDS, studyDueOn, studyStatus, type StudyStatus } from "./thresholds";
export { checkGrrDesign, checkStudyFigures, checkType1Readings, GRR_DESIGN, TYPE1_READINGS } from "./checks";
export { capabilityFor, meanAndSd, type1Study } from "./type1";
export { gaugeBudget, type GaugeBudgetInput } from "./budget";
export { grrAnova, POOL_INTERACTION_ABOVE_P } from "./grr";
export { studyProblem, type StudyProblem, type StudyProblemKind, type StudyUse } from "./study-problem";
