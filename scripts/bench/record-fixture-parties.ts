// BENCHMARK DATA ONLY: the invented shop, customer, engine and build plan of the bench:record V8
// (scripts/bench/record-fixture.ts). Plausible figures, not reference values.
import type { RecordParties } from "@/lib/server/record/repo";

export const BENCH_PLAN = {
  format: "tenthwise.build-plan",
  version: 1,
  lengthUnit: "in",
  volumeUnit: "cc",
  bore: 4.03,
  stroke: 3.48,
  rodLength: 5.7,
  compressionHeight: 1.56,
  pistonTop: "dish",
  pistonVolumeCc: 5,
  chamberCc: 64,
  gasketBore: 4.1,
  gasketThickness: 0.039,
  deckHeight: 9.025,
  intakeLobeLift: 0.3,
  exhaustLobeLift: 0.31,
  rockerRatio: 1.5,
  intakeLash: 0.016,
  exhaustLash: 0.018,
  notes: "Benchmark plan",
};

export const BENCH_PARTIES: RecordParties = {
  shop: { name: "Bench shop (benchmark data)", address: "1 Test Road", phone: null, email: null, unitSystem: "in" },
  customer: { name: "Bench customer", email: "customer@bench.example", phone: null },
  engine: {
    description: "Benchmark small-block V8",
    layout: "v",
    cylinders: 8,
    mains: 5,
    unitSystem: "in",
    nominalBore: 4.03,
    nominalStroke: 3.48,
    blockMaterial: "greyCastIron",
    headMaterial: null,
    pistonMaterial: null,
    blockSerial: "BENCH-1",
    crankSerial: null,
    headSerials: null,
    fuel: null,
  },
};
