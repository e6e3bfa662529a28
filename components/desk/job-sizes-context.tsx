"use client";

import { createContext } from "react";
import type { LengthUnit } from "@/lib/domain";
import type { FinishedSizes } from "@/lib/schemas/job-sizes";

/** The finished sizes of the job whose own limits are edited; none on a template (it has no job). */
export const JobSizesContext = createContext<{ sizes: FinishedSizes; unit: LengthUnit } | null>(null);
