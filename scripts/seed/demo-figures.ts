// In-spec figures a gauge would send at each station of the demo V8 (invented demo data, judged by
// the street sheet in demo-specs.ts), so a scripted entry takes the usual path wherever the route is.
const DEMO_V8_FIGURES: [RegExp, string][] = [
  [/^bore\//, "4.0302"],
  [/^deck\//, "9.0250"],
  [/^main-brg\//, "2.4515"],
  [/^main\//, "2.4490"],
  [/^rod\//, "2.0990"],
  [/^rod-brg\//, "2.1012"],
  [/^skirt\//, "4.0285"],
  [/\/free$/, "2.0000"],
  [/\/loaded$/, "2.0058"],
  [/\/top$/, "0.0180"],
  [/\/second$/, "0.0200"],
  [/\/(third|oil)$/, "0.0300"],
  [/^end-play$/, "0.0040"],
  [/^side\//, "0.0150"],
  [/^lash\/.*\/int/, "0.0180"],
  [/^lash\/.*\/exh/, "0.0200"],
  [/^torque\/main-caps$/, "72"],
  [/^torque\/head-bolts$/, "67"],
  [/^torque\/rod-bolts$/, "47"],
  [/^torque\//, "62"],
];

/** The demo V8's in-spec figure for a station id, as typed on the bench. */
export function demoV8Figure(stationId: string): string {
  const hit = DEMO_V8_FIGURES.find(([re]) => re.test(stationId));
  if (!hit) throw new Error(`No demo figure for station ${stationId}`);
  return hit[1];
}
