import "server-only";
import type { TemplateValues } from "@/lib/schemas/spec";
import { STARTER_DIESEL_FOUR } from "./starter-diesel";
import { STARTER_INLINE_SIX } from "./starter-six";
import { STARTER_V8_STREET } from "./starter-v8";

/** The sheets every new shop starts with (createShop), in the order the spec list shows them. */
export const STARTER_SHEETS: readonly TemplateValues[] = [STARTER_V8_STREET, STARTER_DIESEL_FOUR, STARTER_INLINE_SIX];
