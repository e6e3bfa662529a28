/** Every bench person's password (benchmark data only; the HTTP part of bench:scale signs in with it). */
export const BENCH_PASSWORD = "bench-scale-pass-2026";
