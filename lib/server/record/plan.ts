import "server-only";
import { compressionRatio, cubicInToCc, deckClearanceFor, displacement, rodRatio, valveLift } from "@/lib/domain";
import { buildPlanSchema, pistonCcOf, type BuildPlan } from "@/lib/schemas/build-plan";
import { num, withUnit } from "@/lib/server/record/format";
import type { BuildRecord, Line } from "@/lib/schemas/record";

// The build plan as entered by the lead, and the figures the core computes from it. A figure
// whose inputs are missing is left out; one the core refuses is listed with the core's words.

type Plan = NonNullable<BuildRecord["plan"]>;

function entered(p: BuildPlan): Line[] {
  const u = p.lengthUnit;
  const rows: [string, string][] = [
    ["Bore", withUnit(p.bore, u)],
    ["Stroke", withUnit(p.stroke, u)],
    ["Rod length (centre to centre)", withUnit(p.rodLength, u)],
    ["Piston compression height", withUnit(p.compressionHeight, u)],
    ["Piston top", p.pistonTop === "flat" ? "flat top" : `${p.pistonTop}, ${num(p.pistonVolumeCc, "cc")} cc`],
    ["Chamber volume", p.chamberCc ? `${num(p.chamberCc, "cc")} cc` : ""],
    ["Gasket bore", withUnit(p.gasketBore, u)],
    ["Gasket thickness (compressed)", withUnit(p.gasketThickness, u)],
    ["Block deck height", withUnit(p.deckHeight, u)],
    [
      "Cam lobe lift, intake / exhaust",
      [withUnit(p.intakeLobeLift, u), withUnit(p.exhaustLobeLift, u)].filter(Boolean).join(" / "),
    ],
    ["Rocker ratio", p.rockerRatio ? `${p.rockerRatio}:1` : ""],
    ["Lash, intake / exhaust", [withUnit(p.intakeLash, u), withUnit(p.exhaustLash, u)].filter(Boolean).join(" / ")],
  ];
  return rows.filter(([, v]) => v).map(([label, value]) => ({ label, value }));
}

const has = (...xs: (number | null | undefined)[]): boolean => xs.every((x) => typeof x === "number");

function attempt(problems: string[], what: string, fn: () => Line[]): Line[] {
  try {
    return fn();
  } catch (err) {
    problems.push(`${what}: ${err instanceof Error ? err.message : String(err)}`);
    return [];
  }
}

function figures(p: BuildPlan, cylinders: number, problems: string[]): Line[] {
  const u = p.lengthUnit;
  const out: Line[] = [];
  if (has(p.bore, p.stroke))
    out.push(
      ...attempt(problems, "Displacement", () => {
        const v = displacement(p.bore!, p.stroke!, cylinders);
        const cc = u === "in" ? cubicInToCc(v) : v / 1000;
        const cubicIn = u === "in" ? `${v.toFixed(1)} in³, ` : "";
        return [
          {
            label: `Displacement (${cylinders} cylinders)`,
            value: `${cubicIn}${cc.toFixed(0)} cc, ${(cc / 1000).toFixed(2)} litres`,
          },
        ];
      }),
    );
  if (has(p.rodLength, p.stroke))
    out.push(
      ...attempt(problems, "Rod ratio", () => [
        { label: "Rod ratio (rod length / stroke)", value: rodRatio(p.rodLength!, p.stroke!).toFixed(3) },
      ]),
    );
  let deck: number | null = null;
  if (has(p.deckHeight, p.stroke, p.rodLength, p.compressionHeight))
    out.push(
      ...attempt(problems, "Deck clearance", () => {
        deck = deckClearanceFor({
          deckHeight: p.deckHeight!,
          stroke: p.stroke!,
          rodLength: p.rodLength!,
          compressionHeight: p.compressionHeight!,
        });
        const where =
          deck < 0
            ? "piston above the deck at top dead centre: the parts do not fit as planned"
            : "piston below the deck at top dead centre";
        return [{ label: "Deck clearance", value: `${withUnit(deck, u)} (${where})` }];
      }),
    );
  if (deck !== null && has(p.bore, p.stroke, p.gasketBore, p.gasketThickness, p.chamberCc))
    out.push(
      ...attempt(problems, "Compression ratio", () => {
        const cr = compressionRatio({
          lengthUnit: u,
          bore: p.bore!,
          stroke: p.stroke!,
          gasketBore: p.gasketBore!,
          gasketThickness: p.gasketThickness!,
          deckClearance: deck!,
          chamberCc: p.chamberCc!,
          pistonCc: pistonCcOf(p),
        });
        const parts =
          `swept ${cr.sweptCc.toFixed(1)} cc; chamber ${num(p.chamberCc, "cc")}, gasket ${cr.gasketCc.toFixed(2)}, ` +
          `deck ${cr.deckCc.toFixed(2)}, piston ${pistonCcOf(p).toFixed(1)} cc`;
        return [{ label: "Static compression ratio", value: `${cr.ratio.toFixed(2)}:1 (${parts})` }];
      }),
    );
  for (const [side, lobe, lash] of [
    ["intake", p.intakeLobeLift, p.intakeLash],
    ["exhaust", p.exhaustLobeLift, p.exhaustLash],
  ] as const) {
    if (has(lobe, p.rockerRatio))
      out.push(
        ...attempt(problems, `Valve lift (${side})`, () => {
          const l = valveLift(lobe!, p.rockerRatio!, lash ?? 0);
          return [
            {
              label: `Valve lift, ${side} (gross / net of lash)`,
              value: `${withUnit(l.gross, u)} / ${withUnit(l.net, u)}`,
            },
          ];
        }),
      );
  }
  return out;
}

/** The plan of a job, or null when none was entered (or the stored one no longer reads). */
export function planOf(raw: unknown, cylinders: number): Plan | null {
  if (!raw) return null;
  const parsed = buildPlanSchema.safeParse(raw);
  if (!parsed.success)
    return {
      entered: [],
      figures: [],
      problems: ["The stored build plan could not be read; the lead should open and save it again"],
      notes: null,
    };
  const problems: string[] = [];
  return {
    entered: entered(parsed.data),
    figures: figures(parsed.data, cylinders, problems),
    problems,
    notes: parsed.data.notes ?? null,
  };
}
